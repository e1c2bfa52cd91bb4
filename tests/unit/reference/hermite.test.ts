/**
 * H_n, He_n, ψ_n and d^k H_n: published coefficients, special values,
 * identities across random inputs, and a fresh live sample against mpmath.
 * DLMF and A&S equation numbers are cited from memory.
 */
import { describe, it, expect, beforeAll } from 'vitest'
import Decimal from 'decimal.js'
import { evaluate, evaluateBatch } from '../../../shared/reference/index'
import { mpmath, randomSource, randomDecimal, expectAgrees, relDiff, TestDecimal as D, type MpCase } from './support'

const val = (id: string, params: Record<string, string>, digits = 40) => evaluate(id, params, digits).outputs[0]!

// A&S Table 22.12 (coefficients of H_n(x)), typed from memory; each row
// checked by the recurrence H_{n+1} = 2xH_n − 2nH_{n−1} while typing.
// Row n: coefficients of x^0 … x^n.
const AS_22_12: Array<[number, number[]]> = [
  [0, [1]],
  [1, [0, 2]],
  [2, [-2, 0, 4]],
  [3, [0, -12, 0, 8]],
  [4, [12, 0, -48, 0, 16]],
  [5, [0, 120, 0, -160, 0, 32]],
  [6, [-120, 0, 720, 0, -480, 0, 64]],
  [7, [0, -1680, 0, 3360, 0, -1344, 0, 128]],
  [8, [1680, 0, -13440, 0, 13440, 0, -3584, 0, 256]],
  [9, [0, 30240, 0, -80640, 0, 48384, 0, -9216, 0, 512]],
  [10, [-30240, 0, 302400, 0, -403200, 0, 161280, 0, -23040, 0, 1024]],
]

function poly(coefs: number[], x: string): Decimal {
  return coefs.reduceRight((acc, c) => acc.times(x).plus(c), new D(0))
}
function polyDerivative(coefs: number[]): number[] {
  return coefs.slice(1).map((c, i) => c * (i + 1))
}

describe('A&S Table 22.12: coefficients of H_n', () => {
  const rows = AS_22_12.flatMap(([n, c]) => ['0.3', '-1.7', '2.25', '13.125'].map((x) => [n, x, c] as const))
  it.each(rows)('H_%i(%s) equals the tabulated polynomial', (n, x, c) => {
    const got = val('hermite', { n: String(n), x }, 40)
    expectAgrees(got, poly(c, x).toString(), 40)
  })
  it.each(rows)('d/dx H_%i(%s) equals the derivative of the tabulated polynomial (DLMF 18.9.25)', (n, x, c) => {
    const got = val('hermite-derivative', { n: String(n), k: '1', x }, 40)
    expectAgrees(got, poly(polyDerivative(c), x).toString(), 40)
  })
})

describe('special values', () => {
  it.each(['1', '3', '17', '101', '399'])('H_%s(0) and He_n(0) and ψ_n(0) are exact zeros for odd n', (n) => {
    for (const id of ['hermite', 'hermite-prob', 'hermite-function']) {
      const r = evaluate(id, { n, x: '0' }, 30)
      expect(r.outputs[0]!.value).toBe('0')
      expect(r.outputs[0]!.exact).toBe(true)
      expect(r.certification).toBe('exact')
    }
  })
  // H_n(0) = (−1)^{n/2} n!/(n/2)! for even n (the explicit sum, DLMF 18.5.13, at x = 0).
  it.each([['0', '1'], ['2', '-2'], ['4', '12'], ['10', '-30240'], ['20', '670442572800']])('H_%s(0) = %s exactly', (n, v) => {
    const r = val('hermite', { n, x: '0' }, 25)
    expect(r.exact).toBe(true)
    expect(new D(r.value).eq(v)).toBe(true)
  })
  it('H_400(40) is far past binary64 and carries 60 certified digits', () => {
    const r = val('hermite', { n: '400', x: '40' }, 60)
    expect(r.digits).toBe(60)
    expect(r.value.endsWith('e+748')).toBe(true)
  })
  it('ψ_400(45) is tiny but fully certified', () => {
    const r = val('hermite-function', { n: '400', x: '45' }, 50)
    expect(r.digits).toBe(50)
    expect(r.value).toMatch(/e-163$/)
  })
  it('an input is never passed through a JS number: 0.1 + 1e-30 differs from 0.1', () => {
    const a = val('hermite', { n: '7', x: '0.1' }, 40).value
    const b = val('hermite', { n: '7', x: '0.100000000000000000000000000001' }, 40).value
    expect(a).not.toBe(b)
  })
  it.each([
    [{ n: '2.5', x: '1' }, /n must be an integer/],
    [{ n: '-1', x: '1' }, /n must be an integer from 0/],
    [{ n: '3', x: '1,5' }, /not a decimal number/],
    [{ n: '3' }, /missing parameter 'x'/],
  ])('domain error %j', (params, msg) => {
    expect(() => evaluate('hermite', params as Record<string, string>, 20)).toThrow(msg)
  })
  it('results do not depend on what ran before, and global precision is untouched', () => {
    const first = val('hermite', { n: '33', x: '-2.5' }, 50).value
    evaluate('kummer', { a: '0.5', b: '1.5', z: '-40' }, 90)
    evaluate('hermite-function', { n: '200', x: '3' }, 15)
    expect(val('hermite', { n: '33', x: '-2.5' }, 50).value).toBe(first)
    expect(Decimal.precision).toBe(20)
  })
})

describe('identities across random inputs', () => {
  const { next } = randomSource('hermite identities')
  const points = Array.from({ length: 25 }, () => ({ n: 1 + Math.floor(next() * 150), x: randomDecimal(next, -15, 15, 7) }))

  it.each(points)('recurrence H_{n+1} = 2x H_n − 2n H_{n−1} (DLMF 18.9.1) at n=$n x=$x', ({ n, x }) => {
    const h = [n - 1, n, n + 1].map((k) => new D(val('hermite', { n: String(k), x }).value))
    const scale = D.max(h[1]!.times(x).times(2).abs(), h[0]!.times(2 * n).abs())
    const resid = h[2]!.minus(h[1]!.times(x).times(2)).plus(h[0]!.times(2 * n)).abs()
    expect(resid.div(scale).lt('1e-38')).toBe(true)
  })
  it.each(points)('symmetry H_n(−x) = (−1)^n H_n(x) (DLMF 18.6.1), digit for digit, at n=$n x=$x', ({ n, x }) => {
    const a = val('hermite', { n: String(n), x }).value
    const b = val('hermite', { n: String(n), x: x.startsWith('-') ? x.slice(1) : `-${x}` }).value
    expect(new D(b).eq(new D(a).times(n % 2 ? -1 : 1))).toBe(true)
  })
  it.each(points)('He_n(x) = 2^{−n/2} H_n(x/√2) (DLMF 18.7.11) at n=$n x=$x', ({ n, x }) => {
    const y = new D(x).div(new D(2).sqrt()).toSignificantDigits(90)
    const h = evaluate('hermite', { n: String(n), x: y.toString() }, 45).outputs[0]!
    const he = val('hermite-prob', { n: String(n), x }, 45)
    const expected = new D(h.value).times(new D(2).pow(-n / 2))
    // y carries a relative error ≤ 1e−89, magnified by κ.
    const tol = new D('1e-43').plus(new D(h.kappa ?? '1e10').times('1e-85'))
    expect(relDiff(he.value, expected).lte(tol)).toBe(true)
  })
  it.each(points)('differential equation H″ − 2x H′ + 2n H = 0 (DLMF Table 18.8.1) at n=$n x=$x', ({ n, x }) => {
    const d = [0, 1, 2].map((k) => new D(val('hermite-derivative', { n: String(n), k: String(k), x }).value))
    const scale = D.max(d[2]!.abs(), d[1]!.times(x).times(2).abs(), d[0]!.times(2 * n).abs())
    const resid = d[2]!.minus(d[1]!.times(x).times(2)).plus(d[0]!.times(2 * n)).abs()
    expect(resid.div(scale).lt('1e-38')).toBe(true)
  })
  it.each(['0.05', '-0.2', '0.31'])('generating function Σ H_n(x) tⁿ/n! = e^{2xt − t²} (DLMF 18.12.15), t = %s', (t) => {
    for (const x of ['0.7', '-2.3', '5.5']) {
      const rows = evaluateBatch('hermite', Array.from({ length: 90 }, (_, n) => ({ n: String(n), x })), 45)
      let sum = new D(0), fact = new D(1)
      rows.forEach((r, n) => {
        if (n > 0) fact = fact.times(n)
        sum = sum.plus(new D(r.outputs[0]!.value).times(new D(t).pow(n)).div(fact))
      })
      const exact = new D(x).times(t).times(2).minus(new D(t).pow(2)).exp()
      expect(relDiff(sum, exact).lt('1e-40')).toBe(true)
    }
  })
  it('a batch over many n at one x gives the same digits as single evaluations', () => {
    const cases = Array.from({ length: 60 }, (_, n) => ({ n: String(n), x: points[0]!.x }))
    const batch = evaluateBatch('hermite', cases, 35)
    cases.forEach((c, i) => {
      const single = evaluate('hermite', c, 35).outputs[0]!
      expect(batch[i]!.outputs[0]!.value).toBe(single.value)
      expect(batch[i]!.outputs[0]!.kappa).toBe(single.kappa)
    })
  })
})

describe('live sample against mpmath (fresh random cases each run)', () => {
  const { next } = randomSource('hermite live')
  const cases: MpCase[] = []
  const dg = () => 15 + Math.floor(next() * 86)
  for (let i = 0; i < 40; i++) cases.push({ id: 'hermite', params: { n: String(Math.floor(next() * 400)), x: randomDecimal(next, -40, 40, 6) }, digits: dg() })
  for (let i = 0; i < 25; i++) cases.push({ id: 'hermite-prob', params: { n: String(Math.floor(next() * 250)), x: randomDecimal(next, -40, 40, 5) }, digits: dg() })
  for (let i = 0; i < 25; i++) cases.push({ id: 'hermite-function', params: { n: String(Math.floor(next() * 500)), x: randomDecimal(next, -45, 45, 5) }, digits: dg() })
  // Very large degree, beyond any fixture: mpmath live.
  cases.push({ id: 'hermite', params: { n: '5000', x: '10' }, digits: 40 })
  cases.push({ id: 'hermite-function', params: { n: '3000', x: '-31.5' }, digits: 40 })
  for (let i = 0; i < 12; i++) cases.push({ id: 'hermite-derivative', params: { n: String(Math.floor(next() * 40)), k: String(1 + Math.floor(next() * 4)), x: randomDecimal(next, -6, 6, 4) }, digits: dg() })
  let ref: Array<string | string[]> = []
  beforeAll(() => { ref = mpmath(cases) })
  it.each(cases.map((c, i) => [c.id, JSON.stringify(c.params), c.digits, i] as const))('%s %s to %i digits', (id, _p, digits, i) => {
    const got = evaluate(id, cases[i]!.params, digits).outputs[0]!
    expectAgrees(got, ref[i] as string, digits)
  })
})
