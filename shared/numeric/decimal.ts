/**
 * Decimal helpers. Each computation makes its own Decimal clone; nothing
 * here touches the global Decimal configuration.
 *
 * decimal.js documents exp, ln, log and sqrt as correctly rounded; the
 * basic operations round once to the clone's precision. Error budgets in
 * the engine rely on exactly that and nothing more.
 */
import Decimal from 'decimal.js'
import { exactToString, type ExactDecimal } from './exact'

export type DecimalCtor = typeof Decimal

export function decimalClone(precision: number): DecimalCtor {
  return Decimal.clone({ precision, rounding: Decimal.ROUND_HALF_EVEN, minE: -9e15, maxE: 9e15, toExpNeg: -7, toExpPos: 21 })
}

/** The exact input as a Decimal (the constructor does not round). */
export function exactToDecimal(x: ExactDecimal, D: DecimalCtor): Decimal {
  return new D(exactToString(x))
}

/** M · 2^−F rounded once to D's precision. */
export function fixedToDecimal(M: bigint, F: number, D: DecimalCtor): Decimal {
  if (M === 0n) return new D(0)
  if (F <= 0) return new D((M << BigInt(-F)).toString()).toSignificantDigits(D.precision)
  return new D(`${M * 5n ** BigInt(F)}e-${F}`).toSignificantDigits(D.precision)
}

/** atan(1/m)·2^F by its series, with a bound on the error in units. */
function atanInv(m: bigint, F: number): { v: bigint; err: number } {
  const m2 = m * m
  let t = (1n << BigInt(F)) / m
  let sum = t
  let err = 1
  for (let k = 1; t !== 0n; k++) {
    t /= m2
    const term = t / BigInt(2 * k + 1)
    sum += k % 2 ? -term : term
    err += 2
  }
  return { v: sum, err: err + 1 }
}

const PI_CACHE = new Map<number, Decimal>()

/**
 * π to D's precision, from Machin's formula π = 16 atan(1/5) − 4 atan(1/239)
 * (a classical identity) in fixed point with 40 spare bits, so the error is
 * far below half an ulp before the one final rounding.
 */
export function pi(D: DecimalCtor): Decimal {
  const p = D.precision
  const cached = PI_CACHE.get(p)
  if (cached) return new D(cached)
  const F = Math.ceil(p * 3.3219280948873626) + 40
  const a = atanInv(5n, F)
  const b = atanInv(239n, F)
  const v = fixedToDecimal(16n * a.v - 4n * b.v, F, D)
  PI_CACHE.set(p, v)
  return v
}

/** A relative error budget of k units in the last place at D's precision. */
export const ulps = (D: DecimalCtor, k: number): number => k * 10 ** (1 - D.precision)
