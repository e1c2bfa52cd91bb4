/**
 * parseNumber: every spelling solver codes write, read exactly.
 * Expected values are canonical exact decimals (see shared/parse/types.ts).
 */
import { describe, it, expect } from 'vitest'
import Decimal from 'decimal.js'
import { parseNumber } from '../../../shared/parse/index'
import { parseExactDecimal } from '../../../shared/numeric/exact'

// A clone wide enough to hold any value below exactly (the constructor does not round).
const D = Decimal.clone({ precision: 2000, minE: -9e15, maxE: 9e15 })

describe('decimal spellings (common practice; C strtod grammar, ISO C §7.20.1.3)', () => {
  it.each([
    ['0', '0', 1], ['-0', '0', -1], ['-0.0', '0', -1], ['+0.000e+00', '0', 1],
    ['1', '1e0', 1], ['12', '1.2e1', 1], ['100', '1e2', 1], ['-7', '-7e0', -1],
    ['0.5', '5e-1', 1], ['.5', '5e-1', 1], ['5.', '5e0', 1], ['+1.25', '1.25e0', 1],
    ['0.00150', '1.5e-3', 1], ['1.5e3', '1.5e3', 1], ['1E+05', '1e5', 1], ['1.0e-400', '1e-400', 1],
    ['  22591  ', '2.2591e4', 1], ['\t-3.25\t', '-3.25e0', -1],
    ['0.1000000000000000055511151231257827021181583404541015625', '1.000000000000000055511151231257827021181583404541015625e-1', 1],
    ['1e999999999999999999999', '1e999999999999999999999', 1],
    ['123.456e-999999999999999999999', '1.23456e-999999999999999999997', 1],
  ] as const)('%j → %s', (raw, value, sign) => {
    expect(parseNumber(raw)).toMatchObject({ kind: 'number', value, sign })
  })
})

describe('Fortran D and Q exponents (common practice: D editing, REAL*16 output)', () => {
  it.each([
    ['1.5D+03', '1.5e3'], ['1.5d3', '1.5e3'], ['0.1000000000000000D+01', '1e0'], ['-0.7266953083645608D+14', '-7.266953083645608e13'],
    ['2.0Q-5', '2e-5'], ['0.455580672011332534833705256897851Q+00', '4.55580672011332534833705256897851e-1'], ['1q0', '1e0'],
  ])('%s → %s', (raw, value) => {
    expect(parseNumber(raw)).toMatchObject({ kind: 'number', value })
  })
})

// Fortran 2008 §10.7.2.3.2 Table 10.1: Ew.d writes ±z1z2z3 with no letter when 99 < |exp| ≤ 999.
describe('exponents that lost their letter', () => {
  it.each([
    ['1.234-305', '1.234e-305'], ['-2.5+100', '-2.5e100'], ['0.8713251214177914+103', '8.713251214177914e102'],
    ['-0.1251814180129028+117', '-1.251814180129028e116'], ['0.399153249357484236220139709663480-297', '3.9915324935748423622013970966348e-298'],
    ['.5-3', '5e-4'], ['5.+3', '5e3'],
  ])('%s → %s', (raw, value) => {
    expect(parseNumber(raw)).toMatchObject({ kind: 'number', value })
  })
  it.each(['12-3', '-12+3'])('%s needs a point, so stays text with a hint', (raw) => {
    expect(parseNumber(raw)).toEqual({ kind: 'text', problem: expect.stringContaining('decimal point') })
  })
})

// ISO C99 §7.19.6.1 (%a) and §6.4.4.2. Expected expansions printed by
// CPython: str(decimal.Decimal(float.fromhex(h))), which is exact.
describe('C99 hex floats', () => {
  it.each([
    ['0x1.8p+1', '3e0'], ['0x1p-1', '5e-1'], ['0X1P+0', '1e0'], ['0x0p+0', '0'], ['-0x0p+0', '0'], ['0x.8', '5e-1'], ['0x10', '1.6e1'],
    ['0x1.999999999999ap-4', '1.000000000000000055511151231257827021181583404541015625e-1'],
    ['0x1.0000000000001p+0', '1.0000000000000002220446049250313080847263336181640625e0'],
    ['-0x1.de26863ep+21', '-3.9170087802734375e6'],
    ['0x1.085ec64937a05p+46', '7.2669530836456078125e13'],
    ['0x1p+64', '1.8446744073709551616e19'],
  ])('%s → %s', (raw, value) => {
    expect(parseNumber(raw)).toMatchObject({ kind: 'number', value })
  })

  it('keeps the sign of a negative zero', () => {
    expect(parseNumber('-0x0p+0')).toMatchObject({ kind: 'number', value: '0', sign: -1 })
  })

  it('expands the smallest subnormal binary64 exactly (CPython gives 751 significant digits ending …447265625E-324)', () => {
    const v = parseNumber('0x1p-1074').value!
    expect(v.startsWith('4.9406564584124654417656879286')).toBe(true)
    expect(v.endsWith('2506419718265533447265625e-324')).toBe(true)
    expect(v.replace(/e.*$/, '').replace('.', '').length).toBe(751)
  })

  it('expands the largest binary64 exactly (309 digits, DBL_MAX)', () => {
    const v = parseNumber('-0X1.FFFFFFFFFFFFFP+1023').value!
    expect(v.startsWith('-1.7976931348623157081452742373170435679807056752584499659891747680315726078')).toBe(true)
    expect(v.endsWith('e308')).toBe(true)
    // 2^1024 − 2^971 computed with BigInt, a second way.
    expect(new D(v).neg().eq(new D(((1n << 1024n) - (1n << 971n)).toString()))).toBe(true)
  })

  // An independent check by rational arithmetic: value · 2^−E must equal the
  // hex mantissa M as integers. (decimal.js also reads hex strings, but rounds
  // large negative binary powers to about 20 digits, so it cannot judge here.)
  it('equals M · 2^E exactly for random mantissas and exponents', () => {
    let seed = 12345
    const rnd = (k: number): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed % k }
    for (let i = 0; i < 300; i++) {
      const lead = rnd(16).toString(16)
      const frac = Array.from({ length: rnd(14) }, () => '0123456789abcdef'[rnd(16)]).join('')
      const p = rnd(2200) - 1100
      const neg = rnd(2) === 1
      const hex = `${neg ? '-' : ''}0x${lead}.${frac}p${p}`
      const got = parseNumber(hex)
      expect(got.kind, hex).toBe('number')
      const M = BigInt(`0x${lead}${frac}`)
      const E = p - 4 * frac.length
      const x = parseExactDecimal(got.value!)
      expect(x.neg, hex).toBe(neg && M !== 0n)
      // coef · 10^exp · 2^−E == M, cross-multiplied into integers.
      let lhs = x.coef, rhs = M
      if (x.exp >= 0) lhs *= 10n ** BigInt(x.exp)
      else rhs *= 10n ** BigInt(-x.exp)
      if (E >= 0) rhs <<= BigInt(E)
      else lhs <<= BigInt(-E)
      expect(lhs === rhs, hex).toBe(true)
    }
  })

  it('refuses binary exponents beyond binary128 range', () => {
    expect(parseNumber('0x1p+99999')).toMatchObject({ kind: 'text', problem: expect.stringContaining('out of range') })
    expect(parseNumber('0x1p-99999999999')).toMatchObject({ kind: 'text' })
  })
})

// IEEE 754-2019 §5.12.1 and ISO C §7.19.6.1 (inf, infinity, nan, nan(n-char-sequence));
// MSVC's 1.#INF / 1.#QNAN / 1.#IND and AIX-style NaNQ are common practice.
describe('infinities and NaNs', () => {
  it.each([
    ['inf', 1], ['-inf', -1], ['+Inf', 1], ['INF', 1], ['Infinity', 1], ['-Infinity', -1], ['+infinity', 1],
    ['1.#INF', 1], ['-1.#INF', -1], ['1.#INF00', 1], ['-1.#INF00', -1],
  ] as const)('%s is an infinity of sign %i', (raw, sign) => {
    expect(parseNumber(raw)).toEqual({ kind: 'inf', sign })
  })
  it.each([
    ['nan', 1], ['NaN', 1], ['-nan', -1], ['NAN', 1], ['nan(0x8000)', 1], ['-nan(ind)', -1], ['nan(snan)', 1],
    ['1.#QNAN', 1], ['-1.#QNAN', -1], ['1.#IND', 1], ['-1.#IND', -1], ['1.#SNAN', 1], ['1.#IND00', 1], ['NaNQ', 1], ['NaNS', 1],
  ] as const)('%s is a NaN of sign %i', (raw, sign) => {
    expect(parseNumber(raw)).toEqual({ kind: 'nan', sign })
  })
  it.each(['infinit', 'nan(', 'nan)', '1.#INFINITY', '2.#INF', 'na', 'in'])('%s is text', (raw) => {
    expect(parseNumber(raw).kind).toBe('text')
  })
})

// Fortran 2008 §10.7.2.1: a value that does not fit its field is written as w asterisks.
describe('overflowed fields, empty fields, text', () => {
  it.each(['*', '********', '  **************  '])('%j is an overflowed field', (raw) => {
    expect(parseNumber(raw)).toEqual({ kind: 'overflowed' })
  })
  it.each(['', '   ', '\t'])('%j is empty', (raw) => {
    expect(parseNumber(raw)).toEqual({ kind: 'empty' })
  })
  it.each([
    ['1.2.3', undefined], ['abc', undefined], ['.', undefined], ['e5', undefined], ['1e', undefined], ['1.5E+', undefined], ['--1', undefined],
    ['0x', undefined], ['1.5 e3', undefined], ['0x1.8q+1', undefined],
    ['1,5', 'decimal commas'], ['1,234,567.5', 'group separators'], ['12***', 'ran together'],
  ])('%j is text (hint: %s)', (raw, hint) => {
    const r = parseNumber(raw)
    expect(r.kind).toBe('text')
    if (hint) expect(r.problem).toContain(hint)
    else expect(r.problem).toBeUndefined()
  })
})

describe('canonical form', () => {
  it('never goes through a binary float: values past binary64 range and precision survive', () => {
    const digits = '123456789'.repeat(50)
    expect(parseNumber(`0.${'0'.repeat(400)}${digits}`).value).toBe(`1.${digits.slice(1)}e-401`)
    expect(parseNumber('9007199254740993').value).toBe('9.007199254740993e15')
  })

  it.each([
    ['1.5D+03', '1500'], ['0.00150', '0.0015'], ['-7', '-7'], ['0', '0'],
    ['-0.1251814180129028+117', '-125181418012902800000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000000'],
    ['0x1.999999999999ap-4', '0.1000000000000000055511151231257827021181583404541015625'],
  ])('%s is read back as %s by decimal.js and by parseExactDecimal (shared/numeric/exact.ts)', (raw, plain) => {
    const v = parseNumber(raw).value!
    expect(new D(v).eq(new D(plain))).toBe(true)
    const x = parseExactDecimal(v)
    expect(new D(`${x.neg ? '-' : ''}${x.coef}e${x.exp}`).eq(new D(plain))).toBe(true)
  })

  it('equals decimal.js reading of the same text for random decimals with E, D, Q or no letter', () => {
    let seed = 777
    const rnd = (k: number): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed % k }
    const digits = (k: number): string => Array.from({ length: k }, () => String(rnd(10))).join('')
    for (let i = 0; i < 500; i++) {
      const sign = ['', '-', '+'][rnd(3)]!
      const mant = `${digits(rnd(6))}.${digits(1 + rnd(25))}`
      const e = rnd(1400) - 700
      const letter = ['e', 'E', 'D', 'd', 'Q', ''][rnd(6)]!
      const expText = letter === '' ? (e < 0 ? `${e}` : `+${e}`) : `${e}`
      const raw = `${sign}${mant}${letter}${expText}`
      const got = parseNumber(raw)
      expect(got.kind, raw).toBe('number')
      expect(new D(got.value!).eq(new D(`${sign}${mant}e${e}`)), raw).toBe(true)
      expect(got.value, raw).toMatch(/^-?(?:0|[1-9](?:\.\d*[1-9])?e-?\d+)$/)
    }
  })
})
