/**
 * Exact decimal inputs.
 *
 * Every parameter arrives as a decimal string and is held exactly as
 * coef · 10^exp with a BigInt coefficient. It is never passed through a JS
 * number, so `0.1` stays one tenth.
 */

export class DomainError extends Error {
  constructor(message: string, readonly param?: string) {
    super(message)
    this.name = 'DomainError'
  }
}

/** value = (neg ? −1 : 1) · coef · 10^exp, coef ≥ 0; zero has coef 0. */
export interface ExactDecimal {
  readonly neg: boolean
  readonly coef: bigint
  readonly exp: number
}

const DECIMAL_RE = /^([+-]?)(\d+\.?\d*|\.\d+)(?:[eE]([+-]?\d+))?$/

export function parseExactDecimal(text: string, param = 'value'): ExactDecimal {
  const s = text.trim()
  const m = DECIMAL_RE.exec(s)
  if (!m) throw new DomainError(`${param}: '${text}' is not a decimal number`, param)
  const [, sign, body, expText] = m as unknown as [string, string, string, string | undefined]
  const dot = body.indexOf('.')
  const digits = dot < 0 ? body : body.slice(0, dot) + body.slice(dot + 1)
  const fracLen = dot < 0 ? 0 : body.length - dot - 1
  const e = expText ? Number(expText) : 0
  if (!Number.isSafeInteger(e) || Math.abs(e) > 1e6) {
    throw new DomainError(`${param}: exponent of '${text}' is out of range`, param)
  }
  let coef = BigInt(digits)
  let exp = e - fracLen
  if (coef === 0n) return { neg: false, coef: 0n, exp: 0 }
  while (coef % 10n === 0n) { coef /= 10n; exp++ }
  return { neg: sign === '-', coef, exp }
}

export function fromBigInt(v: bigint): ExactDecimal {
  return normalise({ neg: v < 0n, coef: v < 0n ? -v : v, exp: 0 })
}

function normalise(x: ExactDecimal): ExactDecimal {
  if (x.coef === 0n) return { neg: false, coef: 0n, exp: 0 }
  let { coef, exp } = x
  while (coef % 10n === 0n) { coef /= 10n; exp++ }
  return { neg: x.neg, coef, exp }
}

const POW10: bigint[] = [1n]
export function pow10(k: number): bigint {
  while (POW10.length <= k) POW10.push(POW10[POW10.length - 1]! * 10n)
  return POW10[k]!
}

export const isZero = (x: ExactDecimal): boolean => x.coef === 0n
export const isInteger = (x: ExactDecimal): boolean => x.exp >= 0 || x.coef === 0n

/** Numerator and denominator (a power of ten) of x. */
export function toRational(x: ExactDecimal): { num: bigint; den: bigint } {
  const sign = x.neg ? -1n : 1n
  if (x.exp >= 0) return { num: sign * x.coef * pow10(x.exp), den: 1n }
  return { num: sign * x.coef, den: pow10(-x.exp) }
}

export function toBigIntExact(x: ExactDecimal, param: string): bigint {
  if (!isInteger(x)) throw new DomainError(`${param} must be an integer`, param)
  return toRational(x).num
}

/** A small non-negative integer parameter (n, k, i). */
export function toIndex(x: ExactDecimal, param: string, min: number, max: number): number {
  const v = toBigIntExact(x, param)
  if (v < BigInt(min) || v > BigInt(max)) {
    throw new DomainError(`${param} must be an integer from ${min} to ${max}`, param)
  }
  return Number(v)
}

export function negate(x: ExactDecimal): ExactDecimal {
  return x.coef === 0n ? x : { ...x, neg: !x.neg }
}

export function add(x: ExactDecimal, y: ExactDecimal): ExactDecimal {
  const e = Math.min(x.exp, y.exp)
  const xv = (x.neg ? -1n : 1n) * x.coef * pow10(x.exp - e)
  const yv = (y.neg ? -1n : 1n) * y.coef * pow10(y.exp - e)
  const s = xv + yv
  return normalise({ neg: s < 0n, coef: s < 0n ? -s : s, exp: e })
}

export function mul(x: ExactDecimal, y: ExactDecimal): ExactDecimal {
  return normalise({ neg: x.neg !== y.neg, coef: x.coef * y.coef, exp: x.exp + y.exp })
}

export function halve(x: ExactDecimal): ExactDecimal {
  return normalise({ neg: x.neg, coef: x.coef * 5n, exp: x.exp - 1 })
}

export function exactToString(x: ExactDecimal): string {
  if (x.coef === 0n) return '0'
  return `${x.neg ? '-' : ''}${x.coef}e${x.exp}`
}

/** Approximate magnitude as a JS number (for bounds and estimates only). */
export function approxNumber(x: ExactDecimal): number {
  return Number(exactToString(x))
}

/** floor(|x| · 2^F) with a flag telling whether it is exact (sign kept). */
export function toFixedPoint(x: ExactDecimal, F: number): { v: bigint; exact: boolean } {
  let num: bigint
  let exact: boolean
  if (x.exp >= 0) {
    num = (x.coef * pow10(x.exp)) << BigInt(F)
    exact = true
  } else {
    const den = pow10(-x.exp)
    const scaled = x.coef << BigInt(F)
    num = scaled / den
    exact = num * den === scaled
  }
  return { v: x.neg ? -num : num, exact }
}
