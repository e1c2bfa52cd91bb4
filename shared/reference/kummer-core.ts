/**
 * Fixed-point core for the series 1F1(a; b; z) = Σ (a)_k z^k / ((b)_k k!)
 * (DLMF 13.2.2) at exact decimal a, b, z, with a rigorous error bound.
 *
 * Terms are BigInt multiples of u = 2^−F: T_0 = 2^F, T_{k+1} = trunc(T_k·N_k/D_k)
 * with the exact integer ratio N_k/D_k = (a+k) z / ((b+k)(k+1)). Truncation adds
 * less than one unit, so the error of T_k obeys ε_{k+1} ≤ |r_k| ε_k + 1. The
 * sum is exact in BigInt. The series stops at K > |b| + 1 once
 * ρ = |z|(|a|+K)/((K−|b|)(K+1)) < 1/2 (this bound on |r_j| decreases in j, so
 * it holds for all j ≥ K) and the tail bound (|T_K| + ε_K)·ρ/(1−ρ) is below
 * one unit; the tail bound is added to the radius. A terminating series
 * (a a non-positive integer) has no tail.
 */
import { toRational, approxNumber, type ExactDecimal } from '../numeric/exact'
import { log2Abs, log2Add } from '../numeric/bits'

export interface SeriesRun {
  F: number
  /** Σ T_k (value · 2^F). */
  S: bigint
  /** log2 of the radius of S in units of 2^−F. */
  log2R: number
  /** Σ k·T_k, i.e. z·d/dz of the series (for κ); an approximation. */
  W: bigint
  /** Number of terms used. */
  terms: number
  /** log2 of the largest |term| (units), for cancellation estimates. */
  log2MaxTerm: number
}

export const MAX_TERMS = 200000

const SMALL = 1n << 53n

export function kummerSeries(
  a: ExactDecimal, b: ExactDecimal, z: ExactDecimal, F: number, withDerivative = true,
): SeriesRun {
  const A = toRational(a), B = toRational(b), Z = toRational(z)
  const P = B.den * Z.num
  const Q = A.den * Z.den
  const absA = Math.abs(approxNumber(a)), absB = Math.abs(approxNumber(b)), absZ = Math.abs(approxNumber(z))
  let T = 1n << BigInt(F)
  let S = T
  let W = 0n
  // Error bounds: plain doubles (units) while small, log2 form once they
  // would overflow (large z spans thousands of binary orders).
  let le = -Infinity
  let lsum = -Infinity
  let eps = 0
  let epsSum = 0
  let logMode = false
  let lsumDirty = false
  const leNow = () => (logMode ? le : eps > 0 ? Math.log2(eps) : -Infinity)
  const sumLog = () => (logMode || !lsumDirty ? lsum : epsSum > 0 ? Math.log2(epsSum) : -Infinity)
  let maxT = F
  let log2R = -Infinity
  // N_k = (a_num + k·a_den)·P and (b_num + k·b_den)·Q advance by additions.
  let Nk = A.num * P
  const dN = A.den * P
  let BQ = B.num * Q
  const dBQ = B.den * Q
  let kb = 1n
  let k = 0
  for (; k < MAX_TERMS; k++, Nk += dN, BQ += dBQ, kb++) {
    if (Nk === 0n) { log2R = sumLog(); break }
    const Dk = BQ * kb
    const prod = T * Nk
    const Tn = prod / Dk
    const exactStep = lsum === -Infinity && eps === 0 && Tn * Dk === prod
    const ratio = Math.abs(Number(Nk) / Number(Dk)) * (1 + 1e-12)
    if (!logMode) {
      // plain doubles while they cannot overflow; log2 form beyond
      eps = eps * ratio + (exactStep ? 0 : 1)
      epsSum += eps
      if (epsSum > 1e280) { logMode = true; le = Math.log2(eps); lsum = Math.log2(epsSum) }
      else lsumDirty = true
    } else {
      le = log2Add(le + Math.log2(ratio), exactStep ? -Infinity : 0)
      lsum = log2Add(lsum, le)
    }
    T = Tn
    S += T
    if (withDerivative) W += kb * T
    if (T === 0n && leNow() === -Infinity) { log2R = sumLog(); break }
    const K = k + 1
    if (K > absB + 1) {
      const rho = absZ * (absA + K) / ((K - absB) * (K + 1)) * (1 + 1e-12)
      if (rho < 0.5 && T < SMALL && T > -SMALL) {
        const tl = log2Add(log2Abs(T), leNow())
        const tail = tl + Math.log2(rho / (1 - rho))
        if (tail < 0) {
          log2R = log2Add(sumLog(), tail)
          break
        }
      }
    }
    if ((k & 15) === 0) maxT = Math.max(maxT, log2Abs(T))
  }
  if (k >= MAX_TERMS) { throw new Error('kummer series did not converge within the term limit') }
  // The 1e-12 per ratio and this final margin cover the doubles' own rounding.
  return { F, S, log2R: log2R === -Infinity ? log2R : log2R + 1e-9 + k * 1e-13, W, terms: k + 1, log2MaxTerm: maxT }
}

/**
 * A double-precision pass giving the expected cancellation in bits,
 * log2(max|term| / |sum|); an estimate used to pick the working precision.
 */
export function kummerCancellation(a: number, b: number, z: number): number {
  let t = 1, s = 1, m = 1
  for (let k = 0; k < 100000; k++) {
    t *= (a + k) * z / ((b + k) * (k + 1))
    s += t
    const at = Math.abs(t)
    if (at > m) m = at
    if (!Number.isFinite(s)) return 0
    if (t === 0 || (k > Math.abs(b) + 1 && at < 1e-17 * Math.abs(s) && Math.abs(z) / (k + 1) < 0.5)) break
  }
  if (s === 0) return 64
  return Math.max(0, Math.ceil(Math.log2(m / Math.abs(s))))
}
