/**
 * Fast exact reading of a decimal with an optional exponent (letter E, D or
 * Q, or none after a mantissa with a point), straight from the character
 * codes: no regular expression and no JS number, so a 100,000-row table
 * allocates little more than the strings it keeps. Returns the canonical
 * value (see canonical.ts) or null when the text is not such a decimal.
 */
import { shiftExponent } from './canonical'

const isDigit = (c: number): boolean => c >= 48 && c <= 57

export function scanDecimal(s: string): string | null {
  const n = s.length
  let i = 0
  let c = s.charCodeAt(0)
  const neg = c === 45
  if (c === 43 || c === 45) i++
  const intStart = i
  while (i < n && isDigit(s.charCodeAt(i))) i++
  const intEnd = i
  let fracStart = i, fracEnd = i
  const hasPoint = s.charCodeAt(i) === 46
  if (hasPoint) {
    fracStart = ++i
    while (i < n && isDigit(s.charCodeAt(i))) i++
    fracEnd = i
  }
  if (intEnd - intStart + fracEnd - fracStart === 0) return null
  let exp = 0
  let expText: string | null = null
  if (i < n) {
    c = s.charCodeAt(i)
    const letter = c === 101 || c === 69 || c === 100 || c === 68 || c === 113 || c === 81
    if (letter) c = s.charCodeAt(++i)
    else if (!((c === 43 || c === 45) && hasPoint)) return null
    let expNeg = false
    if (c === 43 || c === 45) { expNeg = c === 45; i++ }
    const es = i
    while (i < n && isDigit(s.charCodeAt(i))) i++
    if (i === es || i !== n) return null
    if (i - es <= 15) {
      for (let k = es; k < i; k++) exp = exp * 10 + (s.charCodeAt(k) - 48)
      if (expNeg) exp = -exp
    } else {
      expText = (expNeg ? '-' : '') + s.slice(es, i)
    }
  }
  // First and last significant digits, skipping the point.
  let first = intStart
  while (first < fracEnd && (s.charCodeAt(first) === 48 || first === intEnd)) first++
  if (first >= fracEnd) return '0'
  let last = fracEnd - 1
  while (s.charCodeAt(last) === 48 || (hasPoint && last === intEnd)) last--
  // Power of ten of the first significant digit, before the written exponent.
  const lead = first < intEnd ? intEnd - 1 - first : -(first - fracStart + 1)
  const digits = first < intEnd && last > intEnd
    ? s.slice(first, intEnd) + s.slice(intEnd + 1, last + 1)
    : s.slice(first, last + 1)
  const mant = digits.length === 1 ? digits : `${digits[0]}.${digits.slice(1)}`
  const e = expText === null ? String(exp + lead) : shiftExponent(expText, lead)
  return `${neg ? '-' : ''}${mant}e${e}`
}
