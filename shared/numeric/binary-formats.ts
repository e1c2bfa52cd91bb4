/**
 * IEEE 754 binary interchange formats: correct rounding, ULPs and ULP
 * distances, all in exact rational arithmetic (BigInt), never through a
 * JS number.
 *
 * Formats (IEEE 754-2019, Table 3.5): binary32 p = 24, emax = 127;
 * binary64 p = 53, emax = 1023; binary128 p = 113, emax = 16383;
 * emin = 1 − emax. Rounding is to nearest, ties to even; values at or past
 * the overflow threshold round to ±∞.
 *
 * ULP of a real x (common practice, the "gap" definition): 2^(max(e, emin) − p + 1)
 * with e = ⌊log2|x|⌋; for x = 0 the smallest subnormal; past the largest
 * finite number, the ULP of the top binade.
 */
import Decimal from 'decimal.js'
import { parseExactDecimal, add, negate, pow10, DomainError, type ExactDecimal } from './exact'
import { bitLength } from './bits'

export type BinaryFormat = 'binary32' | 'binary64' | 'binary128'
export const BINARY_FORMATS: Record<BinaryFormat, { p: number; emax: number; emin: number }> = {
  binary32: { p: 24, emax: 127, emin: -126 },
  binary64: { p: 53, emax: 1023, emin: -1022 },
  binary128: { p: 113, emax: 16383, emin: -16382 },
}

export type Measured =
  | { kind: 'finite'; value: ExactDecimal }
  | { kind: 'infinity'; neg: boolean }
  | { kind: 'nan' }

export interface RoundedBinary {
  kind: 'finite' | 'infinity'
  neg: boolean
  /** value = (neg ? −1 : 1) · significand · 2^exponent (finite only). */
  significand: bigint
  exponent: number
  /** The exact decimal value of the rounded number ('inf'/'-inf'). */
  decimal: string
}

const HEX_RE = /^([+-]?)0x([0-9a-f]*)\.?([0-9a-f]*)p([+-]?\d+)$/i

/** Read a measured value: decimal, C99 hex float, inf/infinity/nan (any case, signed). */
export function parseMeasured(text: string): Measured {
  const s = text.trim()
  const low = s.toLowerCase()
  const bare = low.replace(/^[+-]/, '')
  if (bare === 'nan') return { kind: 'nan' }
  if (bare === 'inf' || bare === 'infinity') return { kind: 'infinity', neg: low.startsWith('-') }
  const h = HEX_RE.exec(s)
  if (h) {
    const [, sign, ip, fp, ex] = h as unknown as [string, string, string, string, string]
    if (!ip && !fp) throw new DomainError(`'${text}' is not a hex float`)
    const m = BigInt(`0x${ip || '0'}${fp}`)
    return { kind: 'finite', value: fromDyadic(sign === '-', m, Number(ex) - 4 * fp.length) }
  }
  return { kind: 'finite', value: parseExactDecimal(s, 'measured') }
}

/** ±m·2^e as an exact decimal. */
export function fromDyadic(neg: boolean, m: bigint, e: number): ExactDecimal {
  if (e >= 0) return parseExactDecimal(`${neg ? '-' : ''}${m << BigInt(e)}`)
  return parseExactDecimal(`${neg ? '-' : ''}${m * 5n ** BigInt(-e)}e${e}`)
}

function toExact(x: Decimal | string | ExactDecimal): ExactDecimal {
  if (typeof x === 'string') return parseExactDecimal(x)
  if (x instanceof Decimal) return parseExactDecimal(x.toString())
  return x
}

/** ⌊log2 |x|⌋ for x ≠ 0, exactly. */
function floorLog2(x: ExactDecimal): number {
  const num = x.exp >= 0 ? x.coef * pow10(x.exp) : x.coef
  const den = x.exp >= 0 ? 1n : pow10(-x.exp)
  let e = bitLength(num) - bitLength(den)
  // adjust so that 2^e ≤ num/den < 2^(e+1)
  const ge = (k: number) => (k >= 0 ? num >= den << BigInt(k) : num << BigInt(-k) >= den)
  while (!ge(e)) e--
  while (ge(e + 1)) e++
  return e
}

/** The ULP exponent q (ULP = 2^q) of the exact value x. */
export function ulpExponent(x: ExactDecimal, format: BinaryFormat): number {
  const { p, emax, emin } = BINARY_FORMATS[format]
  if (x.coef === 0n) return emin - p + 1
  const e = Math.min(Math.max(floorLog2(x), emin), emax)
  return e - p + 1
}

/** ULP of the exact value, as an exact decimal string. */
export function ulpOf(x: Decimal | string | ExactDecimal, format: BinaryFormat): string {
  const q = ulpExponent(toExact(x), format)
  return exactString(fromDyadic(false, 1n, q))
}

function exactString(x: ExactDecimal): string {
  if (x.coef === 0n) return '0'
  return `${x.neg ? '-' : ''}${x.coef}e${x.exp}`
}

/** Round x to the nearest number of the format (ties to even). */
export function roundToFormat(x: Decimal | string | ExactDecimal, format: BinaryFormat): RoundedBinary {
  const v = toExact(x)
  const { p, emax } = BINARY_FORMATS[format]
  if (v.coef === 0n) return { kind: 'finite', neg: false, significand: 0n, exponent: 0, decimal: '0' }
  let q = ulpExponent(v, format)
  const num = v.exp >= 0 ? v.coef * pow10(v.exp) : v.coef
  const den = v.exp >= 0 ? 1n : pow10(-v.exp)
  // |v| / 2^q = N / Dn
  const N = q >= 0 ? num : num << BigInt(-q)
  const Dn = q >= 0 ? den << BigInt(q) : den
  let sig = N / Dn
  const rem2 = 2n * (N - sig * Dn)
  if (rem2 > Dn || (rem2 === Dn && (sig & 1n) === 1n)) sig += 1n
  if (sig === 1n << BigInt(p)) { sig >>= 1n; q += 1 }
  if (bitLength(sig) + q - 1 > emax) return { kind: 'infinity', neg: v.neg, significand: 0n, exponent: 0, decimal: v.neg ? '-inf' : 'inf' }
  return { kind: 'finite', neg: v.neg, significand: sig, exponent: q, decimal: exactString(fromDyadic(v.neg, sig, q)) }
}

export interface UlpDistance {
  /** (measured − exact) / ULP(exact), 20 significant digits; null for NaN. */
  ulps: string | null
  kind: 'finite' | 'overflow-agrees' | 'infinite' | 'nan'
}

const D20 = Decimal.clone({ precision: 20, rounding: Decimal.ROUND_HALF_EVEN, minE: -9e15, maxE: 9e15 })

/**
 * Distance in ULPs of the format between a measured value and the exact
 * reference. A measured ±∞ agrees (0 ULPs) when the reference itself rounds
 * to that infinity in the format; otherwise the distance is infinite.
 */
export function ulpDistance(measured: string | Decimal | Measured, exact: Decimal | string | ExactDecimal, format: BinaryFormat): UlpDistance {
  const m: Measured = typeof measured === 'string' ? parseMeasured(measured)
    : measured instanceof Decimal ? { kind: 'finite', value: toExact(measured) } : measured
  const r = toExact(exact)
  if (m.kind === 'nan') return { ulps: null, kind: 'nan' }
  if (m.kind === 'infinity') {
    const rr = roundToFormat(r, format)
    if (rr.kind === 'infinity' && rr.neg === m.neg) return { ulps: '0', kind: 'overflow-agrees' }
    return { ulps: m.neg ? '-Infinity' : 'Infinity', kind: 'infinite' }
  }
  const diff = add(m.value, negate(r))
  const q = ulpExponent(r, format)
  // diff / 2^q exactly
  const scaled = q <= 0
    ? { ...diff, coef: diff.coef << BigInt(-q) }
    : { ...diff, coef: diff.coef * 5n ** BigInt(q), exp: diff.exp - q }
  return { ulps: new D20(exactString(scaled)).toSignificantDigits(20).toString(), kind: 'finite' }
}

/**
 * Round a certified d-digit reference to the format, and say whether that
 * rounding is settled: the exact value lies within half a unit of the last
 * certified digit, and both ends of that interval must round alike.
 */
export function roundCertifiedToFormat(value: string, digits: number, exactValue: boolean, format: BinaryFormat): { rounded: RoundedBinary; settled: boolean } {
  const v = parseExactDecimal(value)
  const rounded = roundToFormat(v, format)
  if (exactValue || v.coef === 0n) return { rounded, settled: true }
  const lastExp = v.exp + v.coef.toString().length - digits // exponent of the last certified digit
  const half = { neg: false, coef: 5n, exp: lastExp - 1 }
  const lo = roundToFormat(add(v, negate(half)), format)
  const hi = roundToFormat(add(v, half), format)
  return { rounded, settled: lo.decimal === rounded.decimal && hi.decimal === rounded.decimal }
}
