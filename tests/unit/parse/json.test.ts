/**
 * JSON tables: the three documented layouts, numbers taken from the source
 * text (never through JSON.parse), and the bare NaN/Infinity tokens that
 * RFC 8259 §6 excludes but Python's json module writes by default.
 */
import { describe, it, expect } from 'vitest'
import { table, values } from './support'

describe('JSON layouts', () => {
  it('array of objects: columns from keys in first-seen order', () => {
    const t = table('[{"n":0,"x":0.5,"H":1},{"n":1,"H":1,"x":0.5}]')
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(values(t)).toEqual([['0', '5e-1', '1e0'], ['1e0', '5e-1', '1e0']])
  })

  it('array of arrays with a header row', () => {
    const t = table('[["n","x","H"],[0,"0.5","0x1p+0"],[1,0.5,1]]')
    expect(t.headerFound).toBe(true)
    expect(values(t)).toEqual([['0', '5e-1', '1e0'], ['1e0', '5e-1', '1e0']])
  })

  it('array of arrays without a header', () => {
    const t = table('[[0,0.5,1],[1,0.5,1]]')
    expect(t.columns).toEqual(['col1', 'col2', 'col3'])
    expect(t.rows).toHaveLength(2)
  })

  it.each(['rows', 'data'])('{"columns": [...], "%s": [[...]]}', (key) => {
    const t = table(`{"columns":["n","x","H"],"${key}":[[2,0.5,-1]]}`)
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(values(t)).toEqual([['2e0', '5e-1', '-1e0']])
  })
})

describe('JSON numbers are read from the source text', () => {
  it.each([
    ['0.1', '1e-1'],
    ['9007199254740993', '9.007199254740993e15'],
    ['1e-400', '1e-400'],
    ['-2.5E+400', '-2.5e400'],
    ['0.10000000000000000555111512312578270211815834045410156250', '1.000000000000000055511151231257827021181583404541015625e-1'],
  ])('%s → %s', (num, value) => {
    const t = table(`[{"H":${num}}]`)
    expect(t.rows[0]!.fields[0]).toMatchObject({ kind: 'number', raw: num, value })
  })

  it.each([
    ['NaN', 'nan', 1], ['Infinity', 'inf', 1], ['-Infinity', 'inf', -1], ['+Infinity', 'inf', 1], ['nan', 'nan', 1], ['-inf', 'inf', -1],
  ] as const)('bare %s', (tok, kind, sign) => {
    expect(table(`[{"H":${tok}}]`).rows[0]!.fields[0]).toMatchObject({ kind, sign, raw: tok })
  })

  it('strings hold any spelling, null is empty', () => {
    const t = table('[{"a":"1.5D+03","b":"-1.#INF","c":"********","d":null,"e":"\\u0031.5"}]')
    expect(values(t)).toEqual([['1.5e3', 'inf', 'overflowed', 'empty', '1.5e0']])
    expect(t.rows[0]!.fields[4]!.raw).toBe('1.5')
  })

  it('gives each field its own line and column in pretty-printed JSON', () => {
    const t = table('[\n  {\n    "n": 3,\n    "H": -1.2e3\n  }\n]\n')
    expect(t.rows[0]!.line).toBe(2)
    expect(t.rows[0]!.fields.map((f) => [f.line, f.column])).toEqual([[3, 10], [4, 10]])
  })
})

describe('JSON problems', () => {
  it.each([
    ['[{"n":1,}]', 1, 9, 'expected a quoted key'],
    ['[{"n":1}', 1, 9, 'the file ends before this array is closed'],
    ['[{"n":1}]]', 1, 10, 'more text follows'],
    ['[{"n": 1 2}]', 1, 10, 'expected "," or "}"'],
    ['[{"n":"abc}]', 1, 7, 'never ends'],
    ['{"rows":[[1]]}', 1, 1, 'a table in JSON must be'],
    ['[1,2,3]', 1, 1, 'a table in JSON must be'],
  ])('%s → line %i, column %i', (text, line, column, words) => {
    const t = table(text, { format: 'json' })
    expect(t.errors[0]).toMatchObject({ line, column })
    expect(t.errors[0]!.message).toContain(words)
  })

  it('a missing key, a repeated key, a nested value, and a stray word are errors', () => {
    const t = table('[{"n":0,"H":1},\n{"n":1},\n{"n":2,"n":3,"H":1},\n{"n":3,"H":[1]},\n{"n":4,"H":one}]')
    expect(t.errors.map((e) => [e.kind, e.line, e.field])).toEqual([
      ['field-count', 2, 'H'], ['syntax', 3, 'n'], ['syntax', 4, 'H'], ['syntax', 5, 'H'],
    ])
    expect(t.errors[0]!.message).toContain('this object has no "H"')
  })

  it('refuses very deep nesting instead of overflowing the stack', () => {
    const t = table(`${'['.repeat(100000)}${']'.repeat(100000)}`)
    expect(t.errors[0]!.message).toContain('nested too deeply')
  })
})
