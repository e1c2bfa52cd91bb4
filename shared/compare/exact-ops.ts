/**
 * Exact comparisons and differences of ExactDecimal values for judging,
 * safe for any exponent: numbers are aligned only when their magnitudes are
 * close, so a measured 1e999999 never builds a million-digit BigInt.
 *
 * A `Near` is an exact decimal v plus a nudge: the true quantity is v
 * (nudge 0), or lies strictly above (+1) or below (−1) v by less than
 * 10^-GAP_LIMIT·|v|. Nudges appear only when two operands differ in
 * magnitude by more than GAP_LIMIT decades; comparisons still give the
 * exact answer (see cmpNear).
 */
import { pow10, type ExactDecimal } from '../numeric/exact'

export interface Near { v: ExactDecimal; nudge: -1 | 0 | 1 }

const GAP_LIMIT = 2000
export const ZERO: ExactDecimal = { neg: false, coef: 0n, exp: 0 }

/** Decimal digits of a non-negative BigInt (a float estimate, corrected exactly against powers of ten). */
export function digitLength(c: bigint): number {
  if (c === 0n) return 0
  const f = Number(c)
  let d = f === Infinity ? Math.floor(log10Big(c)) + 1 : f < 10 ? 1 : Math.floor(Math.log10(f)) + 1
  if (c >= pow10(d)) d++
  else if (d > 1 && c < pow10(d - 1)) d--
  return d
}

const DEC_RE = /^\s*([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?\s*$/

/**
 * Parse a decimal string exactly, like parseExactDecimal (same normal form:
 * no trailing zeros in the coefficient, zero as 0·10^0) but trimming zeros
 * on the string, which is much faster for certified values such as
 * "2.2591000000000000000e+4". Returns null when the text is not a decimal.
 */
export function parseDecimal(text: string): ExactDecimal | null {
  const m = DEC_RE.exec(text)
  if (!m) return null
  const ip = m[2]!
  const fp = m[3] ?? ''
  if (ip.length === 0 && fp.length === 0) return null
  const e = m[4] === undefined ? 0 : Number(m[4])
  if (!Number.isSafeInteger(e) || Math.abs(e) > 1e6) return null
  const digits = ip + fp
  let a = 0
  while (a < digits.length && digits.charCodeAt(a) === 48) a++
  if (a === digits.length) return ZERO
  let b = digits.length
  while (digits.charCodeAt(b - 1) === 48) b--
  return { neg: m[1] === '-', coef: BigInt(digits.slice(a, b)), exp: e - fp.length + (digits.length - b) }
}

/** 10^(order−1) ≤ |x| < 10^order for x ≠ 0; −Infinity for 0. */
export function order(x: ExactDecimal): number {
  return x.coef === 0n ? -Infinity : digitLength(x.coef) + x.exp
}

/** Compare |a| with |b| exactly: −1, 0 or 1. */
export function cmpAbs(a: ExactDecimal, b: ExactDecimal): -1 | 0 | 1 {
  if (a.coef === 0n || b.coef === 0n) return a.coef === b.coef ? 0 : a.coef === 0n ? -1 : 1
  const oa = order(a)
  const ob = order(b)
  if (oa !== ob) return oa < ob ? -1 : 1
  // Same order: the exponent gap is at most the coefficient length difference.
  const e = Math.min(a.exp, b.exp)
  const x = a.coef * pow10(a.exp - e)
  const y = b.coef * pow10(b.exp - e)
  return x === y ? 0 : x < y ? -1 : 1
}

/** Compare two Near quantities exactly (the true values they stand for). */
export function cmpNear(a: Near, b: Near): -1 | 0 | 1 {
  const c = cmpAbs(a.v, b.v)
  if (c !== 0) return c
  return a.nudge === b.nudge ? 0 : a.nudge < b.nudge ? -1 : 1
}

export const exact = (v: ExactDecimal): Near => ({ v, nudge: 0 })

/** The signed coefficient of x. */
function signed(x: ExactDecimal): bigint {
  return x.neg ? -x.coef : x.coef
}

/**
 * x + y for signed values (the nudge refers to the magnitude), exact unless the magnitudes are more than GAP_LIMIT decades apart. */
export function addNear(x: ExactDecimal, y: ExactDecimal): Near {
  if (x.coef === 0n) return exact(y)
  if (y.coef === 0n) return exact(x)
  const ox = order(x)
  const oy = order(y)
  if (Math.abs(ox - oy) > GAP_LIMIT) {
    // |big + small| is |big| moved towards or away from zero by |small|.
    return { v: ox > oy ? x : y, nudge: x.neg === y.neg ? 1 : -1 }
  }
  const e = Math.min(x.exp, y.exp)
  const s = signed(x) * pow10(x.exp - e) + signed(y) * pow10(y.exp - e)
  return exact(s === 0n ? ZERO : { neg: s < 0n, coef: s < 0n ? -s : s, exp: e })
}

/** |c − r|. */
export function absDiff(c: ExactDecimal, r: ExactDecimal): Near {
  const d = addNear(c, { neg: !r.neg, coef: r.coef, exp: r.exp })
  return d.v.neg ? { v: { neg: false, coef: d.v.coef, exp: d.v.exp }, nudge: d.nudge } : d
}

/** x · y (exact, never aligns). */
export function mulExact(x: ExactDecimal, y: ExactDecimal): ExactDecimal {
  if (x.coef === 0n || y.coef === 0n) return ZERO
  return { neg: x.neg !== y.neg, coef: x.coef * y.coef, exp: x.exp + y.exp }
}

const POW5 = new Map<number, bigint>()
/** 5^k, cached for the exponents the formats use. */
function pow5(k: number): bigint {
  let v = POW5.get(k)
  if (v === undefined) { v = 5n ** BigInt(k); if (POW5.size < 40000) POW5.set(k, v) }
  return v
}

/** x · 2^q exactly. */
export function mulPow2(x: ExactDecimal, q: number): ExactDecimal {
  if (x.coef === 0n) return ZERO
  if (q >= 0) return { neg: x.neg, coef: x.coef << BigInt(q), exp: x.exp }
  return { neg: x.neg, coef: x.coef * pow5(-q), exp: x.exp + q }
}

/**
 * Round the positive value num/den · 10^e10 · 2^pow2 to `sig` significant
 * digits, half to even, in e-notation. For sig = 4 a double estimate
 * in log10 space (relative error below 1e-11) is used unless the digits after the 4th lie
 * within 1e-6 of a rounding boundary; then the exact BigInt division decides.
 */
export function formatRatio(num: bigint, den: bigint, e10: number, sig = 4, pow2 = 0): string {
  if (num === 0n) return '0'
  if (sig === 4) {
    toDouble2(num)
    let L = Math.log10(D_F) + e10
    let k2 = D_K + pow2
    toDouble2(den)
    L -= Math.log10(D_F)
    k2 -= D_K
    L += k2 * LOG10_2
    let e = Math.floor(L)
    let m = 10 ** (L - e)
    if (m >= 10) { m /= 10; e++ } else if (m < 1) { m *= 10; e-- }
    const scaled = m * 1000
    const f = scaled - Math.floor(scaled)
    if (Math.abs(f - 0.5) > 1e-6 && f > 1e-6 && f < 1 - 1e-6) {
      let q = Math.round(scaled)
      if (q >= 10000) { q = 1000; e++ }
      const t = String(q)
      return `${t[0]}.${t.slice(1)}e${e < 0 ? '' : '+'}${e}`
    }
  }
  return pow2 >= 0 ? formatRatioExact(num << BigInt(pow2), den, e10, sig) : formatRatioExact(num, den << BigInt(-pow2), e10, sig)
}

const LOG10_2 = Math.log10(2)

// Scratch results of toDouble2 (no tuple allocation in the judging loop).
let D_F = 0
let D_K = 0

/** v ≈ D_F · 2^D_K with D_F a finite double (v > 0). */
function toDouble2(v: bigint): void {
  const f = Number(v)
  if (f !== Infinity) { D_F = f; D_K = 0; return }
  const shift = v.toString(16).length * 4 - 64
  D_F = Number(v >> BigInt(shift))
  D_K = shift
}

/** formatRatio by exact BigInt division (ties and near-ties). */
export function formatRatioExact(num: bigint, den: bigint, e10: number, sig: number): string {
  // Scale so that the integer quotient has at least sig + 2 digits.
  const shift = Math.max(0, sig + 2 - (digitLength(num) - digitLength(den)))
  const n = num * pow10(shift)
  let q = n / den
  const sticky = q * den !== n
  const ql = digitLength(q)
  const drop = ql - sig
  const unit = pow10(drop)
  let head = q / unit
  const rest = q - head * unit
  const half = unit / 2n
  if (rest > half || (rest === half && (sticky || (head & 1n) === 1n))) head += 1n
  q = head
  let exp10 = e10 - shift + drop + sig - 1
  let digits = q.toString()
  if (digits.length > sig) { digits = digits.slice(0, sig); exp10++ }
  const mant = digits.length > 1 ? `${digits[0]}.${digits.slice(1)}` : digits
  return `${mant}e${exp10 < 0 ? '' : '+'}${exp10}`
}

/** |x| to `sig` significant digits. */
export function formatAbs(x: ExactDecimal, sig = 4): string {
  return formatRatio(x.coef, 1n, x.exp, sig)
}

/** log10 |num/den · 10^e10| as a double (for estimates and digits agreed only). */
export function log10Ratio(num: bigint, den: bigint, e10: number): number {
  return log10Big(num) - log10Big(den) + e10
}

/** log10 of a positive BigInt as a double (absolute error ~1e-13). */
export function log10Big(v: bigint): number {
  toDouble2(v)
  return Math.log10(D_F) + D_K * Math.LOG10E * Math.LN2
}
