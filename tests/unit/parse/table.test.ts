/**
 * parseTable on small inline tables: formats, detection, headers, comments,
 * quoting (RFC 4180 §2), line ends, and the caller's overrides.
 */
import { describe, it, expect } from 'vitest'
import { raws, table, values } from './support'

describe('format and delimiter detection', () => {
  it.each([
    ['n,x,H\n0,0.5,1\n', 'csv', ','],
    ['n;x;H\n0;0.5;1\n', 'csv', ';'],
    ['n|x|H\n0|0.5|1\n', 'csv', '|'],
    ['n\tx\tH\n0\t0.5\t1\n', 'tsv', '\t'],
    ['n x H\n0 0.5 1\n', 'whitespace', ' '],
    ['   0   0.5    1.0\n   1   0.5    1.0\n', 'whitespace', ' '],
    ['[{"n":0,"x":0.5,"H":1}]', 'json', ''],
    ['  \n{"columns":["n"],"rows":[[1]]}', 'json', ''],
  ])('%j is %s', (text, format, delimiter) => {
    const t = table(text)
    expect(t.format).toBe(format)
    expect(t.delimiter).toBe(delimiter)
    expect(t.errorCount).toBe(0)
  })

  it('finds the table behind a long header of comment lines', () => {
    // 400 KB of a run log (past the 256 KB sample) before the first data row
    const log = Array.from({ length: 8000 }, (_, i) => `# step ${i}: residual 1.0e-12, converged in 4 iterations`).join('\n')
    const t = table(`${log}\nn,x,H\n0,0.5,1\n4,0.5,1\n`)
    expect(log.length).toBeGreaterThan(256 * 1024)
    expect(t.format).toBe('csv')
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(raws(t)).toEqual([['0', '0.5', '1'], ['4', '0.5', '1']])
  })

  it('is not fooled by a few rows with the wrong count', () => {
    const t = table('n,x,H\n0,0.5,1\n1,0.5\n2,0.5,-1,9\n5,0.5,41\n')
    expect(t.format).toBe('csv')
    expect(t.errorCount).toBe(2)
  })

  it('counts delimiters outside quotes only, across quoted line ends', () => {
    const t = table('a;b\r\n1;2\r\n"x\r\ny;z";3\r\n4;5\r\n')
    expect(t.delimiter).toBe(';')
    expect(raws(t)).toEqual([['1', '2'], ['x\r\ny;z', '3'], ['4', '5']])
  })

  it.each([
    [{ format: 'whitespace' as const }, 'whitespace', [['1,2', '3']]],
    [{ format: 'csv' as const }, 'csv', [['1', '2 3']]],
    [{ delimiter: ';' }, 'csv', [['1,2 3']]],
    [{ delimiter: '\t' }, 'tsv', [['1,2 3']]],
  ])('the caller can force %j', (options, format, rows) => {
    const t = table('1,2 3\n', { ...options, header: false })
    expect(t.format).toBe(format)
    expect(raws(t)).toEqual(rows)
  })
})

describe('headers', () => {
  it('takes a first line of names as the header', () => {
    const t = table('n,x,H_n(x)\n0,0.5,1\n')
    expect(t.headerFound).toBe(true)
    expect(t.columns).toEqual(['n', 'x', 'H_n(x)'])
    expect(t.rows).toHaveLength(1)
  })

  it('does not take a data line with a label for a header', () => {
    const t = table('case1,0,0.5,1\ncase2,1,0.5,1\n')
    expect(t.headerFound).toBe(false)
    expect(t.columns).toEqual(['col1', 'col2', 'col3', 'col4'])
    expect(t.numeric).toEqual([false, true, true, true])
    expect(t.errorCount).toBe(0)
  })

  it('reads a commented header line just before the data (numpy.savetxt header=…)', () => {
    const t = table('# ladder 2.3.1\n# n x H\n0 0.5 1\n1 0.5 1\n')
    expect(t.headerFound).toBe(true)
    expect(t.columns).toEqual(['n', 'x', 'H'])
  })

  it('ignores a comment that does not split into as many names as there are fields', () => {
    const t = table('# values of H_n(x) for the grid\n0 0.5 1\n')
    expect(t.headerFound).toBe(false)
    expect(t.columns).toEqual(['col1', 'col2', 'col3'])
  })

  it.each([
    [true, ['0', '0.5', '1'], 1],
    [false, ['col1', 'col2', 'col3'], 2],
  ])('header: %s is obeyed', (header, columns, rows) => {
    const t = table('0,0.5,1\n1,0.5,1\n', { header })
    expect(t.columns).toEqual(columns)
    expect(t.rows).toHaveLength(rows)
  })

  it('header: false also ignores a commented header', () => {
    expect(table('# n x H\n0 0.5 1\n', { header: false }).columns).toEqual(['col1', 'col2', 'col3'])
  })

  it('makes duplicate and empty names unique', () => {
    expect(table('x,x,,H\n1,2,3,4\n').columns).toEqual(['x', 'x_2', 'col3', 'H'])
  })
})

describe('comments and blank lines', () => {
  it.each(['# hash', '! bang', '% percent', '// slashes', '   # indented'])('skips the comment line %j', (c) => {
    const t = table(`${c}\nn x H\n\n${c}\n0 0.5 1\n\n`)
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(raws(t)).toEqual([['0', '0.5', '1']])
  })

  it('drops a trailing comment in whitespace columns, but not the # in 1.#INF', () => {
    const t = table('n x H\n300 30 1.#INF   ! overflowed in binary64\n1 0.5 1 # fine\n')
    expect(values(t)).toEqual([['3e2', '3e1', 'inf'], ['1e0', '5e-1', '1e0']])
  })
})

describe('RFC 4180 quoting', () => {
  it('keeps delimiters, doubled quotes and line ends inside quotes, and the line each field starts on', () => {
    const t = table('case,n\n"a, b",1\n"say ""hi""",2\n"two\nlines",3\n  "pad" ,4\n')
    expect(raws(t)).toEqual([['a, b', '1'], ['say "hi"', '2'], ['two\nlines', '3'], ['pad', '4']])
    expect(t.rows.map((r) => r.line)).toEqual([2, 3, 4, 6])
    const f = t.rows[2]!.fields[1]!
    expect([f.line, f.column]).toEqual([5, 8])
    expect(t.rows[3]!.fields[0]!.column).toBe(3)
  })

  it('reads a quoted number as a number', () => {
    expect(values(table('n,H\n"1","-0.5D+01"\n'))).toEqual([['1e0', '-5e0']])
  })

  it('in TSV, keeps spaces trimmed and tabs as delimiters', () => {
    const t = table('n\tx\tH\n 0 \t0.5\t\n')
    expect(raws(t)).toEqual([['0', '0.5', '']])
    expect(t.rows[0]!.fields[2]!.kind).toBe('empty')
  })
})

describe('line ends', () => {
  it.each([['LF', '\n'], ['CRLF', '\r\n'], ['CR', '\r']])('%s', (_, eol) => {
    const t = table(['n,x,H', '0,0.5,1', '1,0.5,1', 'bad,0.5,1'].join(eol) + eol)
    expect(raws(t)).toEqual([['0', '0.5', '1'], ['1', '0.5', '1'], ['bad', '0.5', '1']])
    expect(t.rows.map((r) => r.line)).toEqual([2, 3, 4])
    expect(t.errors[0]).toMatchObject({ line: 4, column: 1, field: 'n' })
  })
})

describe('tolerance for common writers', () => {
  it('drops the empty field a trailing delimiter leaves, with no header too', () => {
    const t = table('0,-3.25,1,\n1,-3.25,-6.5,\n')
    expect(t.columns).toEqual(['col1', 'col2', 'col3'])
    expect(raws(t)).toEqual([['0', '-3.25', '1'], ['1', '-3.25', '-6.5']])
  })

  it('drops the empty field a trailing delimiter leaves, header included', () => {
    const t = table('n,x,H,\n0,-3.25,1,\n1,-3.25,-6.5,\n')
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(values(t)).toEqual([['0', '-3.25e0', '1e0'], ['1e0', '-3.25e0', '-6.5e0']])
    expect(t.errorCount).toBe(0)
  })

  it('splits asterisks glued to the field before them (fixed-width Fortran output)', () => {
    const t = table('  20   2.000**************\n   5   2.000     -16.0000\n  10   2.000  200416.0000\n')
    expect(raws(t)).toEqual([['20', '2.000', '**************'], ['5', '2.000', '-16.0000'], ['10', '2.000', '200416.0000']])
    expect(t.rows[0]!.fields[2]).toMatchObject({ kind: 'overflowed', column: 13 })
    expect(t.errorCount).toBe(0)
  })

  it('reads spaced asterisks as an overflowed field', () => {
    expect(values(table('n x H\n20 2.0 ********\n'))).toEqual([['2e1', '2e0', 'overflowed']])
  })

  it('keeps each field raw as written and its 1-based column', () => {
    const t = table('n   x        H\n  7  0.50   0.1000000000000000D+01\n')
    const [n, x, h] = t.rows[0]!.fields
    expect([n!.raw, n!.column, x!.raw, x!.column, h!.raw, h!.column]).toEqual(['7', 3, '0.50', 6, '0.1000000000000000D+01', 13])
    expect(h).toMatchObject({ kind: 'number', value: '1e0', sign: 1, line: 2 })
  })

  it('treats a column as numeric by majority, or as the caller says', () => {
    const text = 'label,H\nok,1\nbad,2\n'
    expect(table(text).numeric).toEqual([false, true])
    const t = table(text, { numericColumns: ['label', 'H'] })
    expect(t.numeric).toEqual([true, true])
    expect(t.errorCount).toBe(2)
    expect(table(text, { numericColumns: ['value'] }).errors[0]).toMatchObject({ kind: 'missing-column', field: 'value' })
  })
})
