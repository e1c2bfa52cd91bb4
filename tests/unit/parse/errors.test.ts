/**
 * Problems are listed with their 1-based line and column, the column name,
 * and a sentence a person can act on; all are counted, 50 are listed; files
 * over MAX_TABLE_BYTES are refused with their own kind.
 */
import { describe, it, expect } from 'vitest'
import { MAX_LISTED_ERRORS, MAX_TABLE_BYTES, MAX_TABLE_ROWS, parseTable } from '../../../shared/parse/index'
import { table, utf8 } from './support'

describe('errors with line and column', () => {
  const t = table('n,x,value\n0,0.5,1\n1,0.5,1.2.3\n2,0.5\n3,0.5,1,7\n4,zero,1\n5,0.5,1,5\n')

  it('lists every bad row in file order', () => {
    expect(t.errors.map((e) => [e.kind, e.line, e.column, e.field])).toEqual([
      ['not-a-number', 3, 7, 'value'],
      ['field-count', 4, 6, 'value'],
      ['field-count', 5, 9, undefined],
      ['not-a-number', 6, 3, 'x'],
      ['field-count', 7, 9, undefined],
    ])
    expect(t.errorCount).toBe(5)
  })

  it('says where and what in plain words', () => {
    expect(t.errors[0]!.message).toBe('line 3, column 7 (field "value"): "1.2.3" is not a number')
    expect(t.errors[1]!.message).toBe('line 4, column 6: this row has 2 fields but the table has 3 ("n", "x", "value"); "value" is missing')
    expect(t.errors[2]!.message).toBe('line 5, column 9: this row has 4 fields but the table has 3 ("n", "x", "value"); the extra field starts here')
  })

  it('adds a hint where it can', () => {
    const e = table('n x H\n1 0.5 12-3\n2 0.5 1,5\n').errors
    expect(e[0]!.message).toContain('needs a decimal point')
    expect(e[1]!.message).toContain('decimal commas are not read')
  })

  it('hints at fields that ran together when a row is short', () => {
    const e = table('n x H\n1 0.5 1\n2 0.5 1\n 3 4.0**12.5\n').errors
    expect(e.map((x) => [x.kind, x.line, x.column])).toEqual([['not-a-number', 4, 4], ['field-count', 4, 13]])
    expect(e[0]!.message).toContain('ran together')
    expect(e[1]!.message).toContain('run together')
  })

  it('counts columns in characters after a BOM, in the line where the field is', () => {
    const bytes = new Uint8Array([0xef, 0xbb, 0xbf, ...utf8('n\tH\r\n1\toops\r\n2\t3\r\n')])
    expect(parseTable(bytes).errors[0]).toMatchObject({ line: 2, column: 3, field: 'H' })
  })

  it('reports an unclosed quote at the quote and stops there', () => {
    const t = table('case,H\n"a,1\nb,2\n')
    expect(t.errors[0]).toMatchObject({ kind: 'syntax', line: 2, column: 1 })
    expect(t.errors[0]!.message).toContain('never closed')
  })

  it('reports text after a closing quote', () => {
    expect(table('case,H\n"a"b,1\n"c",2\n').errors[0]).toMatchObject({ kind: 'syntax', line: 2, column: 4 })
  })

  it('refuses a file with no data rows', () => {
    expect(table('# nothing here\n\n').errors[0]).toMatchObject({ kind: 'no-data' })
    expect(table('').errorCount).toBe(1)
  })
})

describe('the cap of listed errors', () => {
  const rows = Array.from({ length: 180 }, (_, i) => (i % 3 === 0 ? `${i},0.5,bad${i}` : i % 3 === 1 ? `${i},0.5` : `${i},0.5,1`))
  const t = table(`n,x,H\n${rows.join('\n')}\n`)

  it(`lists the first ${MAX_LISTED_ERRORS} and counts them all`, () => {
    expect(MAX_LISTED_ERRORS).toBe(50)
    expect(t.errors).toHaveLength(50)
    expect(t.errorCount).toBe(120)
    expect(t.errors[0]).toMatchObject({ kind: 'not-a-number', line: 2 })
    expect(t.errors[1]).toMatchObject({ kind: 'field-count', line: 3 })
    expect(t.errors[49]!.line).toBe(75) // the 25th pair: rows 72 and 73, lines 74 and 75
    const lines = t.errors.map((e) => e.line)
    expect([...lines].sort((a, b) => a - b)).toEqual(lines)
  })

  it('counts past the cap for JSON problems too', () => {
    const items = Array.from({ length: 70 }, (_, i) => `{"n":${i},"H":oops}`)
    const j = table(`[${items.join(',\n')}]`)
    expect(j.errorCount).toBe(70)
    expect(j.errors).toHaveLength(50)
    expect(j.errors[0]).toMatchObject({ kind: 'syntax', line: 1, column: 13, field: 'H' })
  })
})

describe('row limit', () => {
  it('refuses a table of more rows than twice the largest reference set, before building rows', () => {
    // 8 bytes a row: 500,000 rows are only 4 MB, far under the byte limit
    const rows = 'n,x,H\n' + '1,0.5,1\n'.repeat(500_000)
    const t = parseTable(utf8(rows))
    expect(t.errors).toEqual([expect.objectContaining({ kind: 'too-large' })])
    expect(t.errors[0]!.message).toContain('the limit is 400,000')
    expect(t.rows).toEqual([])
  })

  it('counts lone CR line ends too, and JSON rows', () => {
    expect(parseTable(utf8('n x H\r' + '1 0.5 1\r'.repeat(MAX_TABLE_ROWS + 2000))).errors[0]?.kind).toBe('too-large')
    const json = JSON.stringify(Array.from({ length: MAX_TABLE_ROWS + 1 }, () => [1, 0.5, 1]))
    expect(parseTable(utf8(json)).errors[0]?.kind).toBe('too-large')
  })

  it('reads a table at the limit', () => {
    const t = parseTable(utf8('n,x,H\n' + '1,0.5,1\n'.repeat(MAX_TABLE_ROWS)))
    expect(t.errorCount).toBe(0)
    expect(t.rows).toHaveLength(MAX_TABLE_ROWS)
  })
})

describe('size limit', () => {
  it('is 50 MiB', () => {
    expect(MAX_TABLE_BYTES).toBe(50 * 1024 * 1024)
  })

  it('refuses one byte more, with its own kind, before reading anything', () => {
    const big = new Uint8Array(MAX_TABLE_BYTES + 1).fill(0x31)
    const t = parseTable(big)
    expect(t.errors).toEqual([expect.objectContaining({ kind: 'too-large', line: 0, column: 0 })])
    expect(t.errors[0]!.message).toContain('the limit is 50.0 MB')
    expect(t.errorCount).toBe(1)
    expect(t.rows).toEqual([])
  })

  it('reads a file of exactly the limit', () => {
    // One long comment keeps this cheap: millions of short rows would need gigabytes of fields.
    const tail = utf8('\n1 0.5 1.0\n')
    const big = new Uint8Array(MAX_TABLE_BYTES).fill(0x78)
    big[0] = 0x23
    big.set(tail, big.length - tail.length)
    const t = parseTable(big)
    expect(t.errors).toEqual([])
    expect(t.rows).toHaveLength(1)
    expect(t.rows[0]!.line).toBe(2)
  })
})
