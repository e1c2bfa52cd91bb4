/**
 * Gauss–Hermite quadrature (`gauss-hermite`): nodes x_i and weights w_i with
 * ∫ f(x) w(x) dx ≈ Σ w_i f(x_i), exact for polynomials of degree ≤ 2n − 1.
 *
 * Convention: weight `physicists` w(x) = e^{−x²} (nodes = zeros of H_n) or
 *   `probabilists` w(x) = e^{−x²/2} (nodes √2·x_i, weights √2·w_i). Nodes are
 *   returned ascending, i = 1…n, symmetric about 0 (x = 0 exactly for odd n).
 * Method: double-precision starts from sign changes of the normalised
 *   recurrence on a fine grid, refined by bisection; then Newton iteration
 *   in BigInt fixed point, x ← x − H_n(x)/(2n H_{n−1}(x)) (DLMF 18.9.25).
 *   Weights w_i = 2^{n−1} n! √π / (n² H_{n−1}(x_i)²) (A&S 25.4.46).
 * Certification (rigorous): H_n is evaluated at x̃ ± η with the bounded
 *   recurrence and must change sign, so a zero lies in (x̃ − η, x̃ + η); the
 *   n intervals are disjoint and H_n has exactly n zeros, so each holds one.
 *   The weight's bound carries both the evaluation error and η.
 * Accuracy: any target digits; every digit correctly rounded.
 */
import { DomainError } from '../numeric/exact'
import { factorial, log2Abs, log2Add } from '../numeric/bits'
import { decimalClone, fixedToDecimal, pi, ulps } from '../numeric/decimal'
import { roundFixedFast, roundDecimalBall, bitsFor, type CertifiedValue } from './certify'
import { runRecurrenceFixed } from './recurrence'
import { positiveZerosDouble, cancellationBitsAt } from './gauss-hermite-starts'

export type QuadratureWeight = 'physicists' | 'probabilists'
export const MAX_RULE_SIZE = 1000

export interface QuadratureRule {
  n: number
  weight: QuadratureWeight
  nodes: CertifiedValue[]
  weights: CertifiedValue[]
}

interface PositiveNode { X: bigint; F: number; log2Eta: number; Mprev: bigint; relPrev: number }

function refineNode(n: number, x0: number, d: number): PositiveNode {
  // Near a zero the bound on H_n is about 2^c units (c = cancellation bits),
  // so η must exceed that for the sign test to prove anything.
  const c = cancellationBitsAt(x0, n)
  let F = bitsFor(d) + c + 48
  for (let attempt = 0; attempt < 4; attempt++, F += 64) {
    const Fb = BigInt(F)
    let X = BigInt(Math.round(x0 * 2 ** 52)) << BigInt(F - 52)
    const xa = x0 * (1 + 2 ** -30) + 2 ** -Math.min(F, 1000)
    for (let it = 0; it < 30; it++) {
      const run = runRecurrenceFixed('H', X, 0, xa, n, F)
      const step = (run.M[n]! << Fb) / (BigInt(2 * n) * run.M[n - 1]!)
      X -= step
      if (step < 256n && step > -256n) break
    }
    for (let log2Eta = c + 4; log2Eta <= c + 28; log2Eta += 12) {
      const eta = 1n << BigInt(log2Eta)
      const lo = runRecurrenceFixed('H', X - eta, 0, xa, n, F)
      const hi = runRecurrenceFixed('H', X + eta, 0, xa, n, F)
      const sure = (r: typeof lo) => r.M[n] !== 0n && log2Abs(r.M[n]!) > r.log2R[n]! + 1
      if (!sure(lo) || !sure(hi) || (lo.M[n]! < 0n) === (hi.M[n]! < 0n)) continue
      // H_{n−1} at the true zero ξ, |ξ − x̃| < η: Taylor to second order,
      // H_{n−1}(ξ) = H_{n−1}(x̃) + (ξ−x̃)·2(n−1)H_{n−2}(x̃) + ½(ξ−x̃)²·H''_{n−1}(θ),
      // |H''_{n−1}| ≤ 4(n−1)(n−2)·A_{n−3} on [−|x̃|−η, |x̃|+η] (DLMF 18.9.25).
      const w = runRecurrenceFixed('H', X, 0, xa + 2 ** (log2Eta - F), n, F, true)
      const Mprev = w.M[n - 1]!
      const e = log2Eta - F
      let l2 = w.log2R[n - 1]!
      if (n >= 2) {
        const l2M2 = log2Add(log2Abs(w.M[n - 2]!), w.log2R[n - 2]!)
        l2 = log2Add(l2, e + Math.log2(2 * (n - 1)) + l2M2)
      }
      if (n >= 3) l2 = log2Add(l2, 2 * e + Math.log2(2 * (n - 1) * (n - 2)) + w.log2A![n - 3]! + F)
      const relPrev = 2 ** (l2 + 1e-9 - log2Abs(Mprev))
      return { X, F, log2Eta, Mprev, relPrev }
    }
  }
  throw new Error(`gauss-hermite: could not certify a node of the ${n}-point rule near ${x0}`)
}

function negateValue(c: CertifiedValue): CertifiedValue {
  return c.value === '0' ? c : { ...c, value: c.value.startsWith('-') ? c.value.slice(1) : `-${c.value}` }
}

export function gaussHermiteRule(n: number, weight: QuadratureWeight, d: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1 || n > MAX_RULE_SIZE) throw new DomainError(`n must be an integer from 1 to ${MAX_RULE_SIZE}`, 'n')
  const starts = positiveZerosDouble(n)
  const pos = starts.map((x0) => refineNode(n, x0, d))
  // Disjoint enclosures, all to the right of 0.
  for (let i = 0; i < pos.length; i++) {
    const p = pos[i]!
    const lo = Number(p.X - (1n << BigInt(p.log2Eta))) / 2 ** p.F
    const prevHi = i === 0 ? 0 : Number(pos[i - 1]!.X + (1n << BigInt(pos[i - 1]!.log2Eta))) / 2 ** pos[i - 1]!.F
    if (!(lo > prevHi)) throw new Error('gauss-hermite: node enclosures overlap')
  }
  const D = decimalClone(d + 12)
  const sqrt2 = new D(2).sqrt()
  const num = new D((factorial(n) << BigInt(n - 1)).toString()).times(pi(D).sqrt()).div(n * n)
  const prob = weight === 'probabilists'
  const wOf = (Mprev: bigint, F: number, rel: number): CertifiedValue => {
    const h = fixedToDecimal(Mprev, F, D)
    let w = num.div(h.times(h))
    if (prob) w = w.times(sqrt2)
    return roundDecimalBall(w, 2 * rel + rel * rel + ulps(D, 8), d)
  }
  const posNodes = pos.map((p) => prob
    ? roundDecimalBall(fixedToDecimal(p.X, p.F, D).times(sqrt2), 2 ** (p.log2Eta - log2Abs(p.X)) + ulps(D, 3), d)
    : roundFixedFast(p.X, p.log2Eta, p.F, d))
  const posWeights = pos.map((p) => wOf(p.Mprev, p.F, p.relPrev))
  const nodes: CertifiedValue[] = []
  const weights: CertifiedValue[] = []
  for (let i = pos.length - 1; i >= 0; i--) { nodes.push(negateValue(posNodes[i]!)); weights.push(posWeights[i]!) }
  if (n % 2 === 1) {
    const F = bitsFor(d) + 32
    const run = runRecurrenceFixed('H', 0n, 0, 0, n, F)
    nodes.push({ value: '0', digits: d, exact: true })
    weights.push(wOf(run.M[n - 1]!, F, 0))
  }
  for (let i = 0; i < pos.length; i++) { nodes.push(posNodes[i]!); weights.push(posWeights[i]!) }
  return { n, weight, nodes, weights }
}

const CACHE = new Map<string, QuadratureRule>()

/** Cached rule, for evaluating one node at a time over a reference set. */
export function cachedRule(n: number, weight: QuadratureWeight, d: number): QuadratureRule {
  const key = `${n}|${weight}|${d}`
  let rule = CACHE.get(key)
  if (!rule) {
    rule = gaussHermiteRule(n, weight, d)
    if (CACHE.size > 32) CACHE.delete(CACHE.keys().next().value!)
    CACHE.set(key, rule)
  }
  return rule
}
