/**
 * Certification: turning an enclosure of the exact value into digits.
 *
 * An enclosure is a midpoint with a radius that provably bounds the error.
 * We round both ends of [mid − rad, mid + rad] to d significant digits
 * (round half away from zero). Rounding is monotone, so when both ends give
 * the same d-digit string every point of the enclosure does too: that string
 * is the exact value correctly rounded to d digits. If the ends differ we try
 * d − 1, d − 2, …, and report how many digits survived. No digit is returned
 * unless it passed this check.
 */
import Decimal from 'decimal.js'
import { bitLength, log2Abs } from '../numeric/bits'
import { pow10 } from '../numeric/exact'

export type CertificationMethod = 'exact' | 'rigorous-bound' | 'precision-agreement'

export interface CertifiedValue {
  /** Correctly rounded significant digits, in e-notation; '0' for an exact zero. */
  value: string
  /** How many significant digits are proven (0: none could be proven). */
  digits: number
  /** The value is exact (not merely rounded from an enclosure). */
  exact: boolean
}

const LOG10_2 = Math.log10(2)

export function formatDigits(neg: boolean, digits: string, e10: number): string {
  const mant = digits.length > 1 ? `${digits[0]}.${digits.slice(1)}` : digits
  return `${neg ? '-' : ''}${mant}e${e10 >= 0 ? '+' : ''}${e10}`
}

/** round(v · 10^s / 2^F) for v > 0, half away from zero. */
function scaleRound(v: bigint, s: number, F: number): bigint {
  if (s >= 0) {
    const t = v * pow10(s)
    return F > 0 ? (t + (1n << BigInt(F - 1))) >> BigInt(F) : t << BigInt(-F)
  }
  const den = pow10(-s) << BigInt(Math.max(F, 0))
  const t = F < 0 ? v << BigInt(-F) : v
  return (2n * t + den) / (2n * den)
}

/**
 * Round the enclosure [M − R, M + R] · 2^−F to at most d significant digits.
 * R ≥ 0. Returns digits = 0 when the sign or leading digit is not proven.
 */
export function roundFixedBall(M: bigint, R: bigint, F: number, d: number): CertifiedValue {
  if (R === 0n && M === 0n) return { value: '0', digits: d, exact: true }
  let lo = M - R
  let hi = M + R
  if (lo <= 0n && hi >= 0n) return { value: '', digits: 0, exact: false }
  const neg = hi < 0n
  if (neg) { const t = -lo; lo = -hi; hi = t }
  let e10 = Math.floor((bitLength(hi) - 1 - F) * LOG10_2)
  for (let dd = d; dd >= 1; dd--) {
    let nHi = 0n
    for (let tries = 0; tries < 4; tries++) {
      nHi = scaleRound(hi, dd - 1 - e10, F)
      if (nHi >= pow10(dd)) e10++
      else if (nHi < pow10(dd - 1)) e10--
      else break
    }
    const nLo = scaleRound(lo, dd - 1 - e10, F)
    if (nLo === nHi) {
      return { value: formatDigits(neg, nHi.toString(), e10), digits: dd, exact: R === 0n && dd >= d }
    }
  }
  return { value: '', digits: 0, exact: false }
}

const DIRECTED = new Map<number, [typeof Decimal, typeof Decimal]>()
function directed(P: number): [typeof Decimal, typeof Decimal] {
  let pair = DIRECTED.get(P)
  if (!pair) {
    pair = [Decimal.clone({ precision: P, rounding: Decimal.ROUND_FLOOR, minE: -9e15, maxE: 9e15 }),
      Decimal.clone({ precision: P, rounding: Decimal.ROUND_CEIL, minE: -9e15, maxE: 9e15 })]
    DIRECTED.set(P, pair)
  }
  return pair
}

/**
 * Same check for a Decimal midpoint with a relative radius `rel` (a double;
 * it is inflated slightly so that its own rounding never undershoots).
 */
export function roundDecimalBall(mid: Decimal, rel: number, d: number): CertifiedValue {
  if (mid.isZero() && rel === 0) return { value: '0', digits: d, exact: true }
  if (!(rel < 1) || !mid.isFinite()) return { value: '', digits: 0, exact: false }
  // Directed rounding, so that [lo, hi] only ever widens.
  const P = Math.max(mid.sd(), (mid.constructor as typeof Decimal).precision) + 12
  const [Dlo, Dhi] = directed(P)
  const m = new Dhi(mid).abs()
  const r = new Dhi((rel * (1 + 1e-9)).toPrecision(17)).times(m)
  const lo = new Dlo(m).minus(r)
  const hi = m.plus(r)
  const neg = mid.isNeg()
  for (let dd = d; dd >= 1; dd--) {
    const a = lo.toSignificantDigits(dd, Decimal.ROUND_HALF_UP)
    const b = hi.toSignificantDigits(dd, Decimal.ROUND_HALF_UP)
    if (a.eq(b)) {
      const [coef, ex] = b.toExponential(dd - 1).split('e') as [string, string]
      return { value: formatDigits(neg, coef.replace('.', ''), Number(ex)), digits: dd, exact: rel === 0 && dd >= d }
    }
  }
  return { value: '', digits: 0, exact: false }
}

/**
 * Agreement of two computations at different working precisions: keep the
 * digits on which both agree after correct rounding of each, less nothing
 * else. Used only where no rigorous bound is carried (see each caller).
 */
export function agreeDigits(lowP: Decimal, highP: Decimal, d: number): CertifiedValue {
  if (lowP.isZero() && highP.isZero()) return { value: '0', digits: d, exact: false }
  if (lowP.isZero() || highP.isZero() || lowP.isNeg() !== highP.isNeg()) return { value: '', digits: 0, exact: false }
  const rel = lowP.minus(highP).abs().div(highP.abs()).toNumber()
  // The difference is an estimate of the lower-precision error; demand a
  // 100× margin before trusting a rounding of the higher-precision value.
  return roundDecimalBall(highP, Math.max(rel * 100, 1e-300), d)
}

/** Working precision (bits) for d digits plus guard bits. */
export const bitsFor = (d: number, guard = 24): number => Math.ceil(d / LOG10_2) + guard

const LOG2_10 = Math.log2(10)

/**
 * Fast path of roundFixedBall for the hot loops. The midpoint is first cut
 * to K = bits(d) + 64 significant bits (one more unit of error), then
 * rounded once as q = round(num/den) with num/den = |M|·10^s·2^−F exactly;
 * the remainder gives the distance to the nearest rounding boundary, which
 * must exceed the scaled radius with a factor-2 margin. When unsure, the
 * careful roundFixedBall decides.
 */
export function roundFixedFast(M: bigint, log2R: number, F: number, d: number): CertifiedValue {
  if (M === 0n) return roundFixedBall(M, ceilPow2Local(log2R), F, d)
  const neg = M < 0n
  const F0 = F
  let exact = log2R === -Infinity
  let a = neg ? -M : M
  // log2|M| roughly (only steers the cut and the first exponent guess).
  let l2 = Math.log2(Number(a))
  if (!Number.isFinite(l2)) l2 = log2Abs(a)
  const K = Math.ceil(d * 3.3219280948873626) + 64
  let lr = log2R
  if (l2 > K + 8 && !exact) {
    const sh = Math.floor(l2) - K
    a >>= BigInt(sh)
    F -= sh
    l2 -= sh
    lr = Math.log2(2 ** (log2R - sh) + 1) // the cut adds < 1 new unit
    if (!Number.isFinite(lr)) lr = log2R - sh
    exact = false
  }
  let e10 = Math.floor((l2 - F) * LOG10_2)
  for (let tries = 0; tries < 3; tries++) {
    const s = d - 1 - e10
    let num = a
    let lmul = 0 // log2 of the factor taking units of 2^−F to units of num
    if (s > 0) { num *= pow10(s); lmul += s * LOG2_10 }
    if (F < 0) { num <<= BigInt(-F); lmul -= F }
    // q = round(num/den), r = distance above the lower rounding boundary
    let q: bigint, r: bigint, den: bigint
    if (s >= 0 && F > 0) {
      // den = 2^F: shifts and masks with cached constants, few allocations
      const c = shiftConsts(F)
      const t = num + c.half
      const qq = t >> c.Fb
      const rr = t & c.mask
      const qs0 = qq.toString()
      if (qs0.length !== d) { if (qs0.length > d) e10++; else e10--; continue }
      const T = exact ? -1 : Math.ceil(lr + lmul + 1)
      const dist = rr < c.half ? rr : c.den - rr
      if (T < 0 ? dist > 0n : dist > pow2(T)) return { value: formatDigits(neg, qs0, e10), digits: d, exact }
      break
    } else {
      den = s < 0 ? pow10(-s) : 1n
      if (F > 0) den <<= BigInt(F)
      const t = 2n * num + den
      const den2 = 2n * den
      q = t / den2
      r = (t - q * den2) >> 1n // halving can only shrink the distance
    }
    const qs = q.toString()
    if (qs.length > d) { e10++; continue }
    if (qs.length < d) { e10--; continue }
    const dist = r < den - r ? r : den - r
    // Radius in num units is R·mul; demand a factor-2 margin.
    const T = exact ? -1 : Math.ceil(lr + lmul + 1)
    if (T < 0 ? dist > 0n : (dist >> BigInt(T)) > 0n) {
      return { value: formatDigits(neg, qs, e10), digits: d, exact }
    }
    break
  }
  return roundFixedBall(M, ceilPow2Local(log2R), F0, d)
}

const SHIFT = new Map<number, { Fb: bigint; den: bigint; half: bigint; mask: bigint }>()
function shiftConsts(F: number): { Fb: bigint; den: bigint; half: bigint; mask: bigint } {
  let c = SHIFT.get(F)
  if (!c) {
    const den = 1n << BigInt(F)
    c = { Fb: BigInt(F), den, half: den >> 1n, mask: den - 1n }
    if (SHIFT.size > 4096) SHIFT.clear()
    SHIFT.set(F, c)
  }
  return c
}

const POW2: bigint[] = []
function pow2(T: number): bigint {
  if (T > 100000) return 1n << BigInt(T)
  let v = POW2[T]
  if (v === undefined) { v = 1n << BigInt(T); POW2[T] = v }
  return v
}

function ceilPow2Local(l2: number): bigint {
  if (l2 === -Infinity) return 0n
  if (l2 < 0) return 1n
  const ip = Math.floor(l2)
  if (ip < 52) return BigInt(Math.ceil(2 ** l2)) + 1n
  return (BigInt(Math.ceil(2 ** (l2 - ip + 52))) + 1n) << BigInt(ip - 52)
}

/** Round an exact decimal to d significant digits (half away from zero). */
export function roundExact(neg: boolean, coef: bigint, exp: number, d: number): CertifiedValue {
  if (coef === 0n) return { value: '0', digits: d, exact: true }
  const s = coef.toString()
  let e10 = s.length - 1 + exp
  let digits: string
  if (s.length <= d) digits = s.padEnd(d, '0')
  else {
    let q = BigInt(s.slice(0, d))
    if (Number(s[d]) >= 5) q += 1n
    digits = q.toString()
    if (digits.length > d) { digits = digits.slice(0, d); e10++ }
  }
  return { value: formatDigits(neg, digits, e10), digits: d, exact: true }
}
