/**
 * Kummer's function M(a, b, z) = 1F1(a; b; z) (`kummer`), DLMF 13.2.2.
 *
 * Convention: the (unregularised) confluent hypergeometric function, real
 *   a, b, z; b = 0, −1, −2, … is a domain error (pole). a = 0, −1, … gives
 *   a polynomial (the series terminates).
 * Method: the power series in BigInt fixed point with a rigorous bound
 *   (kummer-core.ts). For z < 0 Kummer's transformation
 *   M(a, b, z) = e^z M(b − a, b, −z) (DLMF 13.2.39) turns an alternating
 *   series into one of positive terms when b − a > 0; e^z = 1/M(1, 1, −z),
 *   again as a certified series, and the quotient's bound is carried. It is
 *   used when the direct series would cancel more bits than that costs.
 *   Working bits = target + guard + estimated cancellation, raised until the
 *   enclosure rounds to the target digits. Cost grows like |z|.
 * Special values: M(a, b, 0) = 1 exactly.
 * Accuracy: returned digits are the exact value correctly rounded.
 * κ = |z M'/M| with M' from Σ k·T_k (for z < 0: κ = |z + w g'(w)/g(w)|,
 *   g = M(b−a, b, ·), w = −z).
 */
import { DomainError, add, negate, isInteger, approxNumber, parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { log2Abs, bitLength } from '../numeric/bits'
import { roundFixedFast, bitsFor } from './certify'
import { kummerSeries, kummerCancellation, type SeriesRun } from './kummer-core'
import { formatKappa, type ScalarResult } from './hermite'

export const MAX_KUMMER_Z = 5000
const ONE = parseExactDecimal('1')

export function checkKummerParams(b: ExactDecimal, z: ExactDecimal, names = { b: 'b', z: 'z' }): void {
  if (isInteger(b) && (b.neg || b.coef === 0n)) {
    throw new DomainError(`${names.b} must not be zero or a negative integer (M(a, b, z) has a pole there)`, names.b)
  }
  if (Math.abs(approxNumber(z)) > MAX_KUMMER_Z) throw new DomainError(`|${names.z}| must be at most ${MAX_KUMMER_Z}`, names.z)
}

/** W/S as a double (for κ). */
export function ratio(W: bigint, S: bigint): number {
  if (S === 0n) return NaN
  if (W === 0n) return 0
  const sign = (W < 0n) !== (S < 0n) ? -1 : 1
  return sign * 2 ** (log2Abs(W) - log2Abs(S))
}

/** Run the series, raising the precision until relBits ≥ need. */
export function certifiedSeries(
  a: ExactDecimal, b: ExactDecimal, z: ExactDecimal, needBits: number, withDerivative = true,
): SeriesRun {
  let F = needBits + 8 + kummerCancellation(approxNumber(a), approxNumber(b), approxNumber(z))
  for (let attempt = 0; ; attempt++) {
    const run = kummerSeries(a, b, z, F, withDerivative)
    const have = run.S === 0n ? 0 : log2Abs(run.S) - run.log2R
    if (have >= needBits || attempt >= 4) return run
    F += Math.max(32, Math.ceil(needBits - have) + 16)
  }
}

export function isNonPositiveInteger(x: ExactDecimal): boolean {
  return isInteger(x) && (x.neg || x.coef === 0n)
}

export function kummer(a: ExactDecimal, b: ExactDecimal, z: ExactDecimal, d: number): ScalarResult {
  checkKummerParams(b, z)
  let need = bitsFor(d)
  let best: ScalarResult | null = null
  for (let attempt = 0; attempt < 4; attempt++) {
    const r = kummerOnce(a, b, z, d, need)
    if (!best || r.digits > best.digits) best = r
    if (r.digits >= d) return r
    need += 32
  }
  return best!
}

function kummerOnce(a: ExactDecimal, b: ExactDecimal, z: ExactDecimal, d: number, need: number): ScalarResult {
  // Direct series unless its cancellation (bits) would cost more than the
  // two positive series of the transformed form.
  if (!z.neg || isNonPositiveInteger(a) ||
    kummerCancellation(approxNumber(a), approxNumber(b), approxNumber(z)) < Math.min(need, 120)) {
    const run = certifiedSeries(a, b, z, need)
    const cv = roundFixedFast(run.S, run.log2R, run.F, d)
    return { ...cv, kappa: run.S === 0n ? null : formatKappa(Math.abs(ratio(run.W, run.S))) }
  }
  const w = negate(z)
  const g = certifiedSeries(add(b, negate(a)), b, w, need + 2)
  const e = certifiedSeries(ONE, ONE, w, need + 2, false)
  const q = divideEnclosures(g, e, need)
  const cv = roundFixedFast(q.M, q.log2R, q.F, d)
  const k = approxNumber(z) + ratio(g.W, g.S)
  return { ...cv, kappa: g.S === 0n ? null : formatKappa(Math.abs(k)) }
}

/**
 * Quotient of two enclosures S/E (E > 0, both in units 2^−F) as M·2^−G with
 * a radius: relative error ≤ (rs + re)/(1 − re) plus one unit of truncation.
 */
export function divideEnclosures(s: SeriesRun, e: SeriesRun, needBits: number): { M: bigint; log2R: number; F: number } {
  if (s.S === 0n) return { M: 0n, log2R: s.log2R, F: s.F }
  const G = Math.max(64, needBits + 64 + bitLength(e.S) - bitLength(s.S))
  const M = (s.S << BigInt(G)) / e.S
  const rs = 2 ** (s.log2R - log2Abs(s.S))
  const re = 2 ** (e.log2R - log2Abs(e.S))
  const rel = re < 1 ? (rs + re) / (1 - re) * (1 + 1e-12) : Infinity
  const log2R = Math.log2(2 ** (Math.log2(rel) + log2Abs(M) - Math.min(700, log2Abs(M))) * 2 ** Math.min(700, log2Abs(M)) + 1)
  // S/E = M·2^−G·2^(e.F − s.F)
  return { M, log2R: Number.isFinite(log2R) ? log2R : Math.log2(rel) + log2Abs(M) + 1e-9, F: G + s.F - e.F }
}
