/**
 * The solver-output fixtures in fixtures/tables (written by generate.py
 * there, or by hand where named). Each is read whole, and every finite value
 * of H_n(x) is checked against the three-term recurrence
 * H_{n+1} = 2x H_n − 2n H_{n−1}, H_0 = 1, H_1 = 2x (DLMF 18.9.1), computed
 * here with decimal.js at 60 digits, to the precision the writer printed.
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, it, expect } from 'vitest'
import Decimal from 'decimal.js'
import { parseNumber, parseTable, type FieldKind, type ParsedTable } from '../../../shared/parse/index'

const DIR = join(__dirname, '../../../fixtures/tables')
const D = Decimal.clone({ precision: 60, minE: -9e15, maxE: 9e15 })
const load = (name: string): ParsedTable => parseTable(new Uint8Array(readFileSync(join(DIR, name))))

function hermite(n: number, x: string): Decimal {
  const X = new D(x)
  let h0 = new D(1), h1 = X.times(2)
  if (n === 0) return h0
  for (let k = 1; k < n; k++) [h0, h1] = [h1, X.times(2).times(h1).minus(h0.times(2 * k))]
  return h1
}

function kinds(t: ParsedTable, column: number): Partial<Record<FieldKind, number>> {
  const out: Partial<Record<FieldKind, number>> = {}
  for (const r of t.rows) { const k = r.fields[column]!.kind; out[k] = (out[k] ?? 0) + 1 }
  return out
}

interface Expect {
  file: string
  format: ParsedTable['format']
  encoding: ParsedTable['encoding']
  bom: boolean
  columns: string[]
  rows: number
  valueKinds: Partial<Record<FieldKind, number>>
  /** Relative agreement with H_n(x) that the writer's digits allow; null when the value is not H_n. */
  rel: number | null
  spot: Array<[row: number, col: number, raw: string, value: string]>
  /** Rows that are not H_n(x) cases (extra binary64 probes). */
  probes?: number[]
}

const CASES: Expect[] = [
  { file: 'fortran-list-directed.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['col1', 'col2', 'col3'], rows: 19,
    valueKinds: { number: 18, inf: 1 }, rel: 1e-16, spot: [[0, 1, '0.5000000000000000', '5e-1'], [18, 2, 'Infinity', 'inf']] },
  { file: 'fortran-d-format.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 26,
    valueKinds: { number: 26 }, rel: 1e-15, spot: [[0, 2, '0.1000000000000000D+01', '1e0'], [19, 2, '-0.8713251214177914+103', '-8.713251214177914e102']] },
  { file: 'fortran-f-stars.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['col1', 'col2', 'col3'], rows: 18,
    valueKinds: { number: 15, overflowed: 3 }, rel: null, spot: [[5, 2, '**************', 'overflowed'], [16, 2, '-3917008.7803', '-3.9170087803e6']] },
  { file: 'fortran-real16-q.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'psi'], rows: 7,
    valueKinds: { number: 7 }, rel: null, spot: [[0, 2, '0.455580672011332534833705256897851Q+00', '4.55580672011332534833705256897851e-1'], [5, 2, '0.399153249357484236220139709663480-297', '3.9915324935748423622013970966348e-298']] },
  { file: 'c-printf-17g.csv', format: 'csv', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 30,
    valueKinds: { number: 26, inf: 2, nan: 2 }, rel: 2.3e-16, spot: [[26, 2, 'inf', 'inf'], [29, 1, '-nan', 'nan']] },
  { file: 'c-printf-hex.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 20,
    valueKinds: { number: 20 }, rel: 1.2e-16, probes: [18], spot: [[18, 2, '0x0.0000000000001p-1022', parseNumber('0x1p-1074').value!], [16, 2, '-0x1.de26863ep+21', '-3.9170087802734375e6'], [19, 2, '-0x0p+0', '0']] },
  { file: 'numpy-savetxt.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 18,
    valueKinds: { number: 18 }, rel: 1e-17, spot: [[0, 0, '0.000000000000000000e+00', '0'], [3, 2, '4.100000000000000000e+01', '4.1e1']] },
  { file: 'numpy-savetxt-comma.csv', format: 'csv', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 18,
    valueKinds: { number: 18 }, rel: 2.3e-16, spot: [[0, 1, '0.500000', '5e-1']] },
  { file: 'json-records.json', format: 'json', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 12,
    valueKinds: { number: 10, inf: 1, nan: 1 }, rel: 2.3e-16, spot: [[10, 2, 'Infinity', 'inf'], [11, 1, '1e+308', '1e308'], [11, 2, 'NaN', 'nan']] },
  { file: 'json-columns-rows.json', format: 'json', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 6,
    valueKinds: { number: 6 }, rel: 0, spot: [[5, 2, '5080118660096', '5.080118660096e12']] },
  { file: 'json-array-header.json', format: 'json', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 6,
    valueKinds: { number: 6 }, rel: 1.2e-16, spot: [[1, 2, '-0x1.ap+2', '-6.5e0']] },
  { file: 'spreadsheet-bom-crlf.tsv', format: 'tsv', encoding: 'utf-8', bom: true, columns: ['n', 'x', 'H_n(x)'], rows: 8,
    valueKinds: { number: 8 }, rel: 1e-15, spot: [[7, 2, '4', '4e0']] },
  { file: 'msvc-utf16le.csv', format: 'csv', encoding: 'utf-16le', bom: true, columns: ['n', 'x', 'H'], rows: 8,
    valueKinds: { number: 4, inf: 2, nan: 2 }, rel: 2.3e-16, spot: [[4, 2, '1.#INF', 'inf'], [5, 2, '-1.#INF', 'inf'], [6, 2, '-1.#IND', 'nan'], [7, 2, '1.#QNAN', 'nan']] },
  { file: 'utf16be.txt', format: 'whitespace', encoding: 'utf-16be', bom: true, columns: ['n', 'x', 'H'], rows: 5,
    valueKinds: { number: 5 }, rel: 2.3e-16, spot: [[4, 2, '22591', '2.2591e4']] },
  { file: 'quoted-labels.csv', format: 'csv', encoding: 'utf-8', bom: false, columns: ['case', 'n', 'x', 'H'], rows: 5,
    valueKinds: { text: 5 }, rel: null, spot: [[1, 0, 'with, comma', 'text'], [2, 0, 'she said "near zero"', 'text'], [3, 0, 'two\r\nlines', 'text']] },
  { file: 'old-mac-cr.txt', format: 'whitespace', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 3,
    valueKinds: { number: 3 }, rel: 0, spot: [[2, 2, '14', '1.4e1']] },
  { file: 'trailing-delimiter.csv', format: 'csv', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 3,
    valueKinds: { number: 3 }, rel: 0, spot: [[2, 2, '40.25', '4.025e1']] },
  { file: 'semicolon.csv', format: 'csv', encoding: 'utf-8', bom: false, columns: ['n', 'x', 'H'], rows: 3,
    valueKinds: { number: 3 }, rel: 0, spot: [[2, 2, '-1.0000000000000000E+00', '-1e0']] },
]

describe.each(CASES)('$file', (c) => {
  const t = load(c.file)
  const valueCol = c.file === 'quoted-labels.csv' ? 0 : 2

  it('is read whole, with no errors', () => {
    expect(t.errors).toEqual([])
    expect([t.format, t.encoding, t.bom]).toEqual([c.format, c.encoding, c.bom])
    expect(t.columns).toEqual(c.columns)
    expect(t.rows).toHaveLength(c.rows)
    expect(t.rows.every((r) => r.fields.length === c.columns.length)).toBe(true)
    expect(kinds(t, valueCol)).toEqual(c.valueKinds)
  })

  it.each(c.spot)('row %i, column %i: %j → %s', (row, col, raw, value) => {
    const f = t.rows[row]!.fields[col]!
    expect(f.raw).toBe(raw)
    expect(f.value ?? f.kind).toBe(value)
  })

  if (c.rel !== null) it('agrees with H_n(x) by the recurrence to the digits printed', () => {
    let checked = 0
    for (const [i, r] of t.rows.entries()) {
      const [n, x, h] = r.fields
      if (h!.kind !== 'number' || c.probes?.includes(i)) continue
      const ref = hermite(Number(n!.value ?? 0), x!.value!)
      const err = new D(h!.value!).minus(ref).abs()
      expect(err.lte(ref.abs().times(c.rel!)), `line ${r.line}: ${h!.raw} vs ${ref.toString()}`).toBe(true)
      checked++
    }
    expect(checked).toBe(c.valueKinds.number! - (c.probes?.length ?? 0))
  })
})

describe('bad-rows.csv (by hand)', () => {
  const t = load('bad-rows.csv')
  it('lists each bad row where it is', () => {
    expect(t.errors.map((e) => [e.kind, e.line, e.column, e.field])).toEqual([
      ['not-a-number', 4, 7, 'H'],
      ['field-count', 5, 6, 'H'],
      ['field-count', 6, 14, undefined],
      ['field-count', 7, 10, undefined],
      ['not-a-number', 8, 3, 'x'],
      ['not-a-number', 9, 7, 'H'],
    ])
    expect(t.errorCount).toBe(6)
  })
  it('still reads its good rows, including a quoted hex float', () => {
    expect(t.rows[8]!.fields[2]).toMatchObject({ raw: '0x1.8p+1', value: '3e0', line: 10, column: 7 })
  })
})

describe('fortran-f-stars.txt against H_n(x)', () => {
  it('holds H_n(x) rounded to four decimals (F14.4), and asterisks exactly where it does not fit in 14 characters', () => {
    for (const r of load('fortran-f-stars.txt').rows) {
      const [n, x, h] = r.fields
      const ref = hermite(Number(n!.value ?? 0), x!.value!)
      if (h!.kind === 'overflowed') {
        expect(ref.toFixed(4).length, `line ${r.line}`).toBeGreaterThan(14)
        continue
      }
      expect(new D(h!.value!).minus(ref).abs().lte('0.00005'), `line ${r.line}`).toBe(true)
    }
  })
})

describe('fortran-real16-q.txt against psi_n(x)', () => {
  // psi_n(x) = H_n(x) e^{-x^2/2} / sqrt(2^n n! sqrt(pi)), the orthonormal Hermite
  // functions (the usual normalisation, written from memory; the generator used
  // mpmath.hermite), recomputed here at 60 digits with decimal.js.
  it('holds psi_n(x) to the 33 digits printed, through Q and letterless exponents', () => {
    const pi = D.acos(-1)
    const rows = load('fortran-real16-q.txt').rows
    expect(rows).toHaveLength(7)
    for (const r of rows) {
      const [nf, xf, v] = r.fields
      const n = new D(nf!.value!).toNumber()
      const x = new D(xf!.value!)
      let fact = new D(1)
      for (let k = 2; k <= n; k++) fact = fact.times(k)
      const norm = new D(2).pow(n).times(fact).times(pi.sqrt()).sqrt()
      const ref = hermite(n, xf!.value!).times(x.pow(2).div(2).neg().exp()).div(norm)
      expect(new D(v!.value!).minus(ref).abs().lte(ref.abs().times('1e-32')), `line ${r.line}: ${v!.raw}`).toBe(true)
    }
  })
})
