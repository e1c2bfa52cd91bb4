/**
 * Canonical exact decimal strings.
 *
 * A value d₁d₂…d_L · 10^(e − f) (digits as written, f of them after the
 * point, exponent e as written) is rewritten as `[-]d[.ddd]e<k>` with the
 * leading and trailing zeros of the digit string removed. Only string and
 * integer arithmetic on the exponent is done, so nothing is rounded and
 * there is no limit on the number of digits or the size of the exponent.
 */

/** `expText + delta` as a decimal integer string; BigInt when it could lose digits. */
export function shiftExponent(expText: string, delta: number): string {
  if (expText.length <= 15) return String(Number(expText) + delta)
  return String(BigInt(expText) + BigInt(delta))
}

/**
 * Canonical form of ±(intDigits.fracDigits) · 10^expText.
 * Zero comes back as `0` whatever its sign (the caller keeps the sign).
 */
export function canonicalDecimal(neg: boolean, intDigits: string, fracDigits: string, expText: string): string {
  const digits = intDigits + fracDigits
  const L = digits.length
  let i = 0
  while (i < L && digits.charCodeAt(i) === 48) i++
  if (i === L) return '0'
  let j = L
  while (digits.charCodeAt(j - 1) === 48) j--
  const exp = shiftExponent(expText, L - 1 - i - fracDigits.length)
  const mant = j - i === 1 ? digits[i]! : `${digits[i]}.${digits.slice(i + 1, j)}`
  return `${neg ? '-' : ''}${mant}e${exp}`
}
