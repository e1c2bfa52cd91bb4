/**
 * The judging loop's fast paths against the exact general code they stand
 * in for: ulpExp and toFormat against shared/numeric/binary-formats.ts
 * (ulpExponent, roundToFormat), doubleToExact against the bits of the
 * double, and the float-first formatRatio against exact BigInt division.
 * Inputs come from a fixed seeded stream (xoshiro128**), so a failure
 * reproduces.
 */
import { describe, expect, it } from 'vitest'
import { doubleToExact, toFormat, ulpExp } from '../../../shared/compare/binary'
import { formatRatio, formatRatioExact, parseDecimal } from '../../../shared/compare/exact-ops'
import { parseExactDecimal, exactToString } from '../../../shared/numeric/exact'
import { roundToFormat, ulpExponent, type BinaryFormat } from '../../../shared/numeric/binary-formats'
import { Xoshiro128ss } from '../../../shared/grid/prng'

const rng = Xoshiro128ss.fromSeed(20261202)
const digits = (n: number) => Array.from({ length: n }, () => String(rng.next() % 10)).join('')
/** A random decimal string: up to 25 significant digits, exponent in [−lim, lim]. */
function randomDecimal(lim: number): string {
  const d = digits(1 + (rng.next() % 25)).replace(/^0+/, '') || '7'
  const e = (rng.next() % (2 * lim + 1)) - lim
  return `${rng.next() % 2 ? '-' : ''}${d[0]}.${d.slice(1)}e${e}`
}
const samples = (n: number, lim: number) => Array.from({ length: n }, () => randomDecimal(lim))
// (exactToString of a re-parsed value is the normal form: coefficient without trailing zeros.)

describe('parseDecimal equals parseExactDecimal', () => {
  it.each([...samples(40, 400), '0', '-0.000', '+.5', '5.', '120e-3', '0001.0100', '1e1000000'])('%s', (t) => {
    expect(parseDecimal(t)).toEqual(parseExactDecimal(t))
  })
  it.each(['', '.', 'e5', '1e', '1.2.3', '0x10', 'inf', '1e1000001'])('refuses %j', (t) => {
    expect(parseDecimal(t)).toBeNull()
  })
})

describe.each<BinaryFormat>(['binary32', 'binary64', 'binary128'])('%s', (format) => {
  const lim = format === 'binary32' ? 50 : format === 'binary64' ? 330 : 5000
  const xs = [...samples(150, lim), '1', '2', '0.5', '3.4028235677973366e38', '4.9e-324', '2.2250738585072014e-308', '1.7976931348623158e308']
  it('ulpExp agrees with ulpExponent', () => {
    for (const t of xs) {
      const x = parseExactDecimal(t)
      expect(ulpExp({ ...x, neg: false }, format), t).toBe(ulpExponent(x, format))
    }
  })
  it('toFormat agrees with roundToFormat', () => {
    for (const t of xs) {
      const want = roundToFormat(t, format)
      const got = toFormat(t, format)!
      if (want.kind === 'infinity') expect(got, t).toEqual({ inf: true, neg: want.neg })
      else expect(got.inf ? 'inf' : exactToString(parseExactDecimal(exactToString(got.value))), t).toBe(want.decimal)
    }
  })
})

describe('doubleToExact', () => {
  it.each([
    [1, '1e0'], [0.5, '5e-1'], [0.1, '1000000000000000055511151231257827021181583404541015625e-55'],
    [-3, '-3e0'], [5e-324, '4940656458412465441765687928682213723650598026143247644255856825006755072702087518652998363616359923797965646954457177309266567103559397963987747960107818781263007131903114045278458171678489821036887186360569987307230500063874091535649843873124733972731696151400317153853980741262385655911710266585566867681870395603106249319452715914924553293054565444011274801297099995419319894090804165633245247571478690147267801593552386115501348035264934720193790268107107491703332226844753335720832431936092382893458368060106011506169809753078342277318329247904982524730776375927247874656084778203734469699533647017972677717585125660551199131504891101451037862738167250955837389733598993664809941164205702637090279242767544565229087538682506419718265533447265625e-1074'],
    [1.7976931348623157e308, '179769313486231570814527423731704356798070567525844996598917476803157260780028538760589558632766878171540458953514382464234321326889464182768467546703537516986049910576551282076245490090389328944075868508455133942304583236903222948165808559332123348274797826204144723168738177180919299881250404026184124858368e0'],
  ])('%s', (v, exact) => {
    expect(exactToString(doubleToExact(v))).toBe(exact)
  })
})

describe('formatRatio: the double estimate rounds like exact division', () => {
  it('on 3000 random ratios and powers of two', () => {
    for (let i = 0; i < 3000; i++) {
      const num = BigInt(digits(1 + (rng.next() % 60)).replace(/^0+/, '') || '3')
      const den = BigInt(digits(1 + (rng.next() % 60)).replace(/^0+/, '') || '7')
      const e10 = (rng.next() % 800) - 400
      const p2 = (rng.next() % 4000) - 2000
      const fast = formatRatio(num, den, e10, 4, p2)
      const exact = p2 >= 0 ? formatRatioExact(num << BigInt(p2), den, e10, 4) : formatRatioExact(num, den << BigInt(-p2), e10, 4)
      expect(fast, `${num}/${den}e${e10}·2^${p2}`).toBe(exact)
    }
  })
  it.each([
    // Exact ties and near-ties go to the exact division.
    [12345n, 1n, 0, '1.234e+4'], [12355n, 1n, 0, '1.236e+4'], [1234500000000000000001n, 1n, 0, '1.235e+21'],
    [99995n, 1n, 0, '1.000e+5'], [10005n, 10000n, 0, '1.000e+0'], [10015n, 10000n, 0, '1.002e+0'],
  ])('%s / %s · 10^%i → %s', (num, den, e10, text) => {
    expect(formatRatio(num, den, e10)).toBe(text)
  })
})
