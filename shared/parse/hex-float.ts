/**
 * C99 hexadecimal floating constants, as written by printf %a and read by
 * strtod (ISO C99 §7.19.6.1 for %a, §7.20.1.3 for strtod; §6.4.4.2 for the
 * constant syntax): `[±]0x h[.hhh] [p±d]`, value h.hhh₁₆ · 2^d.
 *
 * Method: with m the hex digit string read as an integer and f its number of
 * fraction digits, the value is m · 2^(d − 4f). A negative power 2^−k equals
 * 5^k · 10^−k, so every such value has a finite decimal expansion, found
 * exactly with BigInt. The binary exponent is taken without `p` as zero
 * (strtod allows that; printf always writes `p`).
 *
 * Limit: the value lies within 2^±MAX_BINARY_EXPONENT, enough for every IEEE 754
 * interchange format up to binary128 (smallest subnormal 2^−16494).
 */
import { canonicalDecimal } from './canonical'

export const MAX_BINARY_EXPONENT = 16_600

const HEX_RE = /^([+-]?)0[xX]([0-9a-fA-F]*)(?:\.([0-9a-fA-F]*))?(?:[pP]([+-]?\d+))?$/

// Powers of five for the common binary64 range, kept as they are reused row after row.
const POW5: bigint[] = [1n]
function pow5(k: number): bigint {
  if (k > 1100) return 5n ** BigInt(k)
  while (POW5.length <= k) POW5.push(POW5[POW5.length - 1]! * 5n)
  return POW5[k]!
}

export type HexReading =
  | { ok: true; neg: boolean; value: string }
  | { ok: false; problem: string }
  | null

/** null when the text is not hex-float syntax at all. */
export function readHexFloat(s: string): HexReading {
  const m = HEX_RE.exec(s)
  if (!m) return null
  const neg = m[1] === '-'
  const intHex = m[2] ?? ''
  const fracHex = m[3] ?? ''
  if (intHex.length + fracHex.length === 0) return null
  const pText = m[4] ?? '0'
  if (pText.replace(/^[+-]?0*/, '').length > 7) return { ok: false, problem: 'its binary exponent is out of range' }
  let hex = (intHex + fracHex).replace(/^0+/, '')
  let binExp = Number(pText) - 4 * fracHex.length
  if (hex === '') return { ok: true, neg, value: '0' }
  // Trailing zero hex digits only scale the power of two.
  let t = hex.length
  while (hex.charCodeAt(t - 1) === 48) t--
  binExp += 4 * (hex.length - t)
  hex = hex.slice(0, t)
  let mant = BigInt(`0x${hex}`)
  while ((mant & 1n) === 0n) { mant >>= 1n; binExp++ }
  if (binExp < -MAX_BINARY_EXPONENT || binExp + 4 * hex.length > MAX_BINARY_EXPONENT) {
    return { ok: false, problem: 'its binary exponent is out of range' }
  }
  if (binExp >= 0) return { ok: true, neg, value: canonicalDecimal(neg, (mant << BigInt(binExp)).toString(), '', '0') }
  const k = -binExp
  return { ok: true, neg, value: canonicalDecimal(neg, (mant * pow5(k)).toString(), '', String(-k)) }
}
