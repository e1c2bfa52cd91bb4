/**
 * Gauss–Hermite rules: A&S Table 25.10, the weight sum, exactness for
 * polynomials of degree ≤ 2n − 1, ordering and symmetry, both weights,
 * n = 300 to 40 digits, and a fresh live sample against mpmath.
 * A&S and DLMF equation numbers are cited from memory.
 */
import { describe, it, expect, beforeAll } from 'vitest'
import { gaussHermiteRule, evaluate } from '../../../shared/reference/index'
import { mpmath, randomSource, expectAgrees, relDiff, TestDecimal as D, type MpCase } from './support'

// A&S Table 25.10 (abscissas and weight factors for Hermite integration),
// positive nodes, 15 places as printed; typed from memory.
const AS_25_10: Array<[number, string, string]> = [
  [2, '0.707106781186548', '8.86226925452758e-1'],
  [3, '0', '1.18163590060368'],
  [3, '1.22474487139159', '2.95408975150919e-1'],
  [4, '0.524647623275290', '8.04914090005513e-1'],
  [4, '1.65068012388578', '8.13128354472452e-2'],
  [5, '0', '9.45308720482942e-1'],
  [5, '0.958572464613819', '3.93619323152241e-1'],
  [5, '2.02018287045609', '1.99532420590459e-2'],
]

describe('A&S Table 25.10', () => {
  it.each(AS_25_10)('n = %i: node %s, weight %s', (n, x, w) => {
    const rule = gaussHermiteRule(n, 'physicists', 40)
    const i = rule.nodes.findIndex((c) => relDiff(c.value, x).lt('1e-13') || (x === '0' && c.value === '0'))
    expect(i).toBeGreaterThanOrEqual(0)
    expect(relDiff(rule.weights[i]!.value, w).lt('1e-13')).toBe(true)
  })
})

const SIZES = [1, 2, 7, 20, 64, 101]

describe.each(['physicists', 'probabilists'] as const)('%s weight', (weight) => {
  const total = weight === 'physicists' ? new D(-1).acos().sqrt() : new D(-1).acos().times(2).sqrt()
  it.each(SIZES)('n = %i: ascending, symmetric, 40+ digits, weights sum to √π or √(2π)', (n) => {
    const r = gaussHermiteRule(n, weight, 45)
    const xs = r.nodes.map((c) => new D(c.value))
    for (let i = 0; i < n; i++) {
      expect(r.nodes[i]!.digits).toBeGreaterThanOrEqual(45)
      expect(r.weights[i]!.digits).toBeGreaterThanOrEqual(45)
      if (i > 0) expect(xs[i]!.gt(xs[i - 1]!)).toBe(true)
      expect(xs[i]!.plus(xs[n - 1 - i]!).isZero()).toBe(true)
      expect(r.weights[i]!.value).toBe(r.weights[n - 1 - i]!.value)
    }
    const sum = r.weights.reduce((s, w) => s.plus(w.value), new D(0))
    expect(relDiff(sum, total).lt('1e-43')).toBe(true)
  })
  // ∫ x^{2k} w(x) dx = Γ(k + ½) = (2k−1)!!/2^k √π (physicists), (2k−1)!! √(2π) (probabilists).
  it.each(SIZES)('n = %i: exact for every monomial of degree ≤ 2n − 1', (n) => {
    const r = gaussHermiteRule(n, weight, 45)
    const E = D.clone({ precision: 70 })
    const xs = r.nodes.map((c) => new E(c.value))
    const ws = r.weights.map((c) => new E(c.value))
    const pw = ws.map((w) => w) // w_i x_i^deg, advanced one degree at a time
    let dfact = new E(1)
    const tot = new E(total)
    for (let deg = 0; deg <= 2 * n - 1; deg++) {
      if (deg > 0) xs.forEach((x, i) => { pw[i] = pw[i]!.times(x) })
      const q = pw.reduce((s, t) => s.plus(t), new E(0))
      const scale = pw.reduce((s, t) => s.plus(t.abs()), new E(0))
      if (deg % 2) {
        expect(q.isZero() || q.abs().div(scale).lt('1e-40')).toBe(true)
        continue
      }
      const k = deg / 2
      if (k > 0) dfact = dfact.times(2 * k - 1)
      const exact = weight === 'physicists' ? dfact.div(new E(2).pow(k)).times(tot) : dfact.times(tot)
      // Relative to Σ|terms|: high moments are dominated by the outer nodes.
      expect(q.minus(exact).abs().div(scale).lt('1e-40')).toBe(true)
    }
  })
})

it('probabilists’ rule is the physicists’ scaled by √2 (nodes and weights)', () => {
  const a = gaussHermiteRule(30, 'physicists', 50)
  const b = gaussHermiteRule(30, 'probabilists', 50)
  a.nodes.forEach((x, i) => {
    expect(relDiff(new D(x.value).times(new D(2).sqrt()), b.nodes[i]!.value).lt('1e-49') || x.value === '0').toBe(true)
    expect(relDiff(new D(a.weights[i]!.value).times(new D(2).sqrt()), b.weights[i]!.value).lt('1e-49')).toBe(true)
  })
})

it.each(['physicists', 'probabilists'] as const)('n = 300 (%s): every node and weight certified to 40 digits', (weight) => {
  const r = gaussHermiteRule(300, weight, 40)
  expect(Math.min(...r.nodes.map((c) => c.digits), ...r.weights.map((c) => c.digits))).toBeGreaterThanOrEqual(40)
  const sum = r.weights.reduce((s, w) => s.plus(w.value), new D(0))
  const total = weight === 'physicists' ? new D(-1).acos().sqrt() : new D(-1).acos().times(2).sqrt()
  expect(relDiff(sum, total).lt('1e-38')).toBe(true)
})

it('rejects n outside 1…1000 and i > n', () => {
  expect(() => gaussHermiteRule(0, 'physicists', 20)).toThrow(/n must be/)
  expect(() => evaluate('gauss-hermite', { n: '4', i: '5' }, 20)).toThrow(/i must be at most n/)
  expect(() => evaluate('gauss-hermite', { n: '4', i: '1', weight: 'hermite' }, 20)).toThrow(/weight must be one of/)
})

describe('live sample against mpmath Newton iteration (fresh random rules each run)', () => {
  const { next } = randomSource('gauss-hermite live')
  const cases: MpCase[] = []
  for (let j = 0; j < 6; j++) {
    const n = 2 + Math.floor(next() * 80)
    const weight = next() < 0.5 ? 'physicists' : 'probabilists'
    const digits = 15 + Math.floor(next() * 86)
    for (let k = 0; k < 3; k++) cases.push({ id: 'gauss-hermite', params: { n: String(n), weight, i: String(1 + Math.floor(next() * n)) }, digits })
  }
  let ref: Array<string | string[]> = []
  beforeAll(() => { ref = mpmath(cases) })
  it.each(cases.map((c, i) => [JSON.stringify(c.params), c.digits, i] as const))('%s to %i digits', (_p, digits, i) => {
    const r = evaluate('gauss-hermite', cases[i]!.params, digits)
    expectAgrees(r.outputs[0]!, (ref[i] as string[])[0]!, digits, 'node')
    expectAgrees(r.outputs[1]!, (ref[i] as string[])[1]!, digits, 'weight')
  })
})
