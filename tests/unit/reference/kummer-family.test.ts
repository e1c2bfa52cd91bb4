/**
 * Kummer's M, the Hermite-equation series and D_ν: DLMF identities across
 * random inputs, special cases, domain errors, and a fresh live sample
 * against mpmath (hyp1f1, pcfd, and a direct sum of the series recurrence).
 * DLMF equation numbers are cited from memory.
 */
import { describe, it, expect, beforeAll } from 'vitest'
import { evaluate } from '../../../shared/reference/index'
import { mpmath, randomSource, randomDecimal, expectAgrees, relDiff, TestDecimal as D, type MpCase } from './support'

const M = (a: string, b: string, z: string, digits = 45) => evaluate('kummer', { a, b, z }, digits).outputs[0]!
const neg = (s: string) => (s.startsWith('-') ? s.slice(1) : `-${s}`)

describe('Kummer M(a, b, z): DLMF identities on random inputs', () => {
  const { next } = randomSource('kummer identities')
  const pts = Array.from({ length: 15 }, () => ({
    a: randomDecimal(next, -8, 8, 3), b: randomDecimal(next, 0.2, 9, 3), z: randomDecimal(next, -45, 45, 3),
  }))
  it.each(pts)('M(a, a, z) = e^z (DLMF 13.6.1) at a=$a z=$z', ({ a, z }) => {
    expectAgrees(M(a, a, z), new D(z).exp().toString(), 45)
  })
  it.each(pts)('Kummer transformation M(a,b,z) = e^z M(b−a,b,−z) (DLMF 13.2.39) at $a, $b, $z', ({ a, b, z }) => {
    const lhs = M(a, b, z)
    const rhs = new D(M(new D(b).minus(a).toString(), b, neg(z)).value).times(new D(z).exp())
    expect(relDiff(lhs.value, rhs).lt('1e-43')).toBe(true)
  })
  it.each(pts)('contiguous relation (b−a)M(a−1) + (2a−b+z)M(a) − aM(a+1) = 0 (DLMF 13.3.1) at $a, $b, $z', ({ a, b, z }) => {
    const A = new D(a)
    const m0 = new D(M(A.minus(1).toString(), b, z).value)
    const m1 = new D(M(a, b, z).value)
    const m2 = new D(M(A.plus(1).toString(), b, z).value)
    const t = [m0.times(new D(b).minus(a)), m1.times(A.times(2).minus(b).plus(z)), m2.times(A).neg()]
    const scale = D.max(...t.map((v) => v.abs()))
    expect(t[0]!.plus(t[1]!).plus(t[2]!).abs().div(scale).lt('1e-42')).toBe(true)
  })
})

describe('Kummer M: special cases and domain', () => {
  it.each([['2.5', '7'], ['-0.75', '-31.5'], ['10', '0.001']])('a = −2 terminates: M(−2, b, z) = 1 − 2z/b + z²/(b(b+1)) with b=%s z=%s', (b, z) => {
    const B = new D(b), Z = new D(z)
    const exact = new D(1).minus(Z.times(2).div(B)).plus(Z.pow(2).div(B.times(B.plus(1))))
    expectAgrees(M('-2', b, z), exact.toString(), 45)
  })
  it('M(a, b, 0) = 1 exactly', () => {
    const r = M('3.3', '-4.5', '0')
    expect(r.exact).toBe(true)
    expect(new D(r.value).eq(1)).toBe(true)
  })
  it.each(['0', '-1', '-7'])('b = %s is a pole: domain error', (b) => {
    expect(() => M('0.5', b, '1')).toThrow(/b must not be zero or a negative integer/)
  })
  it('b a negative non-integer is fine', () => {
    expect(M('0.5', '-2.5', '1.5', 30).digits).toBe(30)
  })
})

describe('hermite-series: λ integer gives Hermite polynomials', () => {
  it.each([['0', '1'], ['2', '1'], ['4', '2'], ['10', '5']])('λ = %s: y_even = H_λ(x)/H_λ(0)', (lam) => {
    for (const x of ['0.3', '-2.75', '6.5']) {
      const y = evaluate('hermite-series', { lambda: lam, x }, 40).outputs[0]!
      const h = new D(evaluate('hermite', { n: lam, x }, 50).outputs[0]!.value)
      const h0 = new D(evaluate('hermite', { n: lam, x: '0' }, 50).outputs[0]!.value)
      expectAgrees(y, h.div(h0).toString(), 40)
    }
  })
  it.each(['1', '3', '9'])('λ = %s: y_odd = H_λ(x)/H_λ′(0)', (lam) => {
    for (const x of ['0.3', '-2.75', '6.5']) {
      const y = evaluate('hermite-series', { lambda: lam, x }, 40).outputs[1]!
      const h = new D(evaluate('hermite', { n: lam, x }, 50).outputs[0]!.value)
      const d0 = new D(evaluate('hermite-derivative', { n: lam, k: '1', x: '0' }, 50).outputs[0]!.value)
      expectAgrees(y, h.div(d0).toString(), 40)
    }
  })
  it('x = 0: y_even = 1 and y_odd = 0 exactly', () => {
    const r = evaluate('hermite-series', { lambda: '3.7', x: '0' }, 30)
    expect(r.outputs[0]!.exact && new D(r.outputs[0]!.value).eq(1)).toBe(true)
    expect(r.outputs[1]!.value).toBe('0')
  })
})

describe('parabolic cylinder D_ν(z)', () => {
  it.each([['0', '1.5'], ['3', '-2.2'], ['7', '4'], ['25', '12.5']])('D_n(z) = e^{−z²/4} He_n(z) (DLMF 12.7.2) at n=%s z=%s', (n, z) => {
    const he = new D(evaluate('hermite-prob', { n, x: z }, 50).outputs[0]!.value)
    const exact = he.times(new D(z).pow(2).div(-4).exp())
    expectAgrees(evaluate('parabolic-cylinder', { nu: n, z }, 40).outputs[0]!, exact.toString(), 40)
  })
  const { next } = randomSource('pcf identities')
  const pts = Array.from({ length: 6 }, () => ({ nu: randomDecimal(next, -6, 6, 3), z: randomDecimal(next, -6, 8, 3) }))
  it.each(pts)('recurrence D_{ν+1} − z D_ν + ν D_{ν−1} = 0 (DLMF 12.8.1) at ν=$nu z=$z', ({ nu, z }) => {
    const v = (s: string) => new D(evaluate('parabolic-cylinder', { nu: s, z }, 35).outputs[0]!.value)
    const t = [v(new D(nu).plus(1).toString()), v(nu).times(z).neg(), v(new D(nu).minus(1).toString()).times(nu)]
    const scale = D.max(...t.map((x) => x.abs()))
    expect(t[0]!.plus(t[1]!).plus(t[2]!).abs().div(scale).lt('1e-32')).toBe(true)
  })
  it('domain: |z| > 40 for non-integer ν is refused; integer ν is not', () => {
    expect(() => evaluate('parabolic-cylinder', { nu: '0.5', z: '41' }, 20)).toThrow(/\|z\| must be at most 40/)
    expect(evaluate('parabolic-cylinder', { nu: '4', z: '300' }, 20).outputs[0]!.digits).toBe(20)
  })
})

describe('live sample against mpmath (fresh random cases each run)', () => {
  const { next } = randomSource('kummer-family live')
  const cases: MpCase[] = []
  const dg = () => 15 + Math.floor(next() * 86)
  for (let i = 0; i < 40; i++) {
    const b = next() < 0.2 ? `-${randomDecimal(next, 0.1, 9, 2)}5` : randomDecimal(next, 0.1, 12, 3)
    cases.push({ id: 'kummer', params: { a: randomDecimal(next, -10, 10, 3), b, z: randomDecimal(next, -100, 100, 3) }, digits: dg() })
  }
  for (let i = 0; i < 30; i++) cases.push({ id: 'hermite-series', params: { lambda: randomDecimal(next, -5, 30, 4), x: randomDecimal(next, -9, 9, 3) }, digits: dg() })
  for (let i = 0; i < 12; i++) cases.push({ id: 'parabolic-cylinder', params: { nu: randomDecimal(next, -8, 8, 3), z: randomDecimal(next, -8, 12, 3) }, digits: dg() })
  let ref: Array<string | string[]> = []
  beforeAll(() => { ref = mpmath(cases) })
  it.each(cases.map((c, i) => [c.id, JSON.stringify(c.params), c.digits, i] as const))('%s %s to %i digits', (id, _p, digits, i) => {
    const r = evaluate(id, cases[i]!.params, digits)
    const exp = Array.isArray(ref[i]) ? (ref[i] as string[]) : [ref[i] as string]
    exp.forEach((e, j) => expectAgrees(r.outputs[j]!, e, digits, `output ${j}`))
  })
})
