/**
 * Fast exact helpers for binary formats in the judging loop (the general
 * versions live in shared/numeric/binary-formats.ts; these give the same
 * answers, checked against them in tests/unit/compare/binary.test.ts).
 *
 * - ulpExp: the ULP exponent q (ULP = 2^q) of an exact value, IEEE 754-2019
 *   gap definition, with ⌊log2|x|⌋ from a float estimate that is confirmed
 *   exactly with BigInt whenever it lies within 1e-9 of an integer.
 * - toFormat: a measured decimal rounded to the format. For binary64 text
 *   of at most 20 significant digits, ECMAScript's Number() is specified to
 *   round correctly to nearest (ECMA-262, RoundMVResult), and the double is
 *   then expanded exactly from its bits; anything else goes through the
 *   exact roundToFormat.
 */
import { pow10, type ExactDecimal } from '../numeric/exact'
import { BINARY_FORMATS, roundToFormat, type BinaryFormat } from '../numeric/binary-formats'
import { log10Big, mulPow2, parseDecimal, ZERO } from './exact-ops'

const LOG2_10 = Math.log2(10)

/** Exactly: is |x| ≥ 2^k? */
function atLeastPow2(x: ExactDecimal, k: number): boolean {
  // |x| = coef·10^exp against 2^k, cross-multiplied into integers.
  let lhs = x.coef
  let rhs = 1n
  if (x.exp >= 0) lhs *= pow10(x.exp)
  else rhs = pow10(-x.exp)
  if (k >= 0) rhs <<= BigInt(k)
  else lhs <<= BigInt(-k)
  return lhs >= rhs
}

/** ⌊log2 |x|⌋ for x ≠ 0, exactly. */
export function floorLog2(x: ExactDecimal): number {
  const l2 = log10Big(x.coef) * LOG2_10 + x.exp * LOG2_10
  let e = Math.floor(l2)
  const frac = l2 - e
  if (frac > 1e-9 && frac < 1 - 1e-9) return e
  while (!atLeastPow2(x, e)) e--
  while (atLeastPow2(x, e + 1)) e++
  return e
}

/** ULP exponent q of the exact value x in the format (ULP = 2^q). */
export function ulpExp(x: ExactDecimal, format: BinaryFormat): number {
  const { p, emax, emin } = BINARY_FORMATS[format]
  if (x.coef === 0n) return emin - p + 1
  return Math.min(Math.max(floorLog2(x), emin), emax) - p + 1
}

const VIEW = new DataView(new ArrayBuffer(8))

/** The exact value of a finite double. */
export function doubleToExact(v: number): ExactDecimal {
  if (v === 0) return ZERO
  VIEW.setFloat64(0, v)
  const hi = VIEW.getUint32(0)
  const lo = VIEW.getUint32(4)
  const bits = (hi >>> 20) & 0x7ff
  let m = (hi & 0xfffff) * 4294967296 + lo
  let e = bits === 0 ? -1074 : bits - 1075
  if (bits !== 0) m += 4503599627370496
  while (m % 2 === 0 && e < 0) { m /= 2; e++ }
  return mulPow2({ neg: v < 0, coef: BigInt(m), exp: 0 }, e)
}

export type InFormat = { inf: false; value: ExactDecimal } | { inf: true; neg: boolean }

/** Significant digits of a plain decimal string (leading and trailing zeros of the digits left out). */
function significantDigits(text: string): number {
  let first = -1
  let last = -1
  let count = 0
  for (let i = 0; i < text.length; i++) {
    const ch = text.charCodeAt(i)
    if (ch === 101 || ch === 69) break // e, E
    if (ch < 48 || ch > 57) continue
    if (ch !== 48 && first < 0) first = count
    if (ch !== 48) last = count
    count++
  }
  return first < 0 ? 0 : last - first + 1
}

/** The number of the format that the measured decimal text names; null when it is not a decimal. */
export function toFormat(text: string, format: BinaryFormat): InFormat | null {
  if (format === 'binary64' && DECIMAL_TEXT.test(text) && significantDigits(text) <= 20) {
    const v = Number(text)
    if (Number.isFinite(v)) return { inf: false, value: doubleToExact(v) }
    return { inf: true, neg: v < 0 }
  }
  const x = parseDecimal(text)
  if (x === null) return null
  const r = roundToFormat(x, format)
  if (r.kind === 'infinity') return { inf: true, neg: r.neg }
  return { inf: false, value: mulPow2({ neg: r.neg, coef: r.significand, exp: 0 }, r.exponent) }
}

const DECIMAL_TEXT = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d{1,6})?\s*$/
