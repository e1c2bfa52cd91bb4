/**
 * Even and odd power-series solutions of the Hermite equation
 * y'' − 2x y' + 2λ y = 0 for real λ (`hermite-series`), with a0 = 1, a1 = 1:
 *   y_even(x) = 1F1(−λ/2; 1/2; x²),  y_odd(x) = x · 1F1((1−λ)/2; 3/2; x²)
 * (coefficients a_{k+2} = 2(k − λ) a_k / ((k+1)(k+2)); the 1F1 forms follow
 * from DLMF 13.2.2 term by term). For λ = n a non-negative integer the series
 * of n's parity terminates and is H_n up to a constant (e.g. λ = 2:
 * y_even = 1 − 2x² = −H_2/2).
 *
 * Method: the certified Kummer series (kummer-core.ts) at z = x² ≥ 0, so no
 *   transformation is needed; the working bits rise with the cancellation
 *   among the first terms at large |x|. y_odd multiplies the enclosure by
 *   the exact x.
 * Special values: y_even(0) = 1, y_odd(0) = 0, both exact.
 * Accuracy: digits are the exact values correctly rounded.
 * κ: even 2|z M'/M|, odd |1 + 2 z M'/M| (x d/dx = 2z d/dz).
 */
import { add, mul, negate, halve, parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { log2Abs } from '../numeric/bits'
import { roundFixedFast, bitsFor } from './certify'
import { certifiedSeries, checkKummerParams, ratio } from './kummer'
import { formatKappa, type ScalarResult } from './hermite'
import { scaleByExact } from './scale'

const ONE = parseExactDecimal('1')
const HALF = parseExactDecimal('0.5')
const THREE_HALVES = parseExactDecimal('1.5')

export function hermiteSeries(lambda: ExactDecimal, x: ExactDecimal, d: number): { even: ScalarResult; odd: ScalarResult } {
  const z = mul(x, x)
  checkKummerParams(HALF, z, { b: 'b', z: 'x' })
  const aEven = halve(negate(lambda))
  const aOdd = halve(add(ONE, negate(lambda)))
  let even: ScalarResult | null = null
  let odd: ScalarResult | null = null
  for (let need = bitsFor(d); need < bitsFor(d) + 200; need += 48) {
    if (!even || even.digits < d) {
      const s = certifiedSeries(aEven, HALF, z, need)
      const cv = roundFixedFast(s.S, s.log2R, s.F, d)
      if (!even || cv.digits > even.digits) even = { ...cv, kappa: formatKappa(2 * Math.abs(ratio(s.W, s.S))) }
    }
    if (!odd || odd.digits < d) {
      const s = certifiedSeries(aOdd, THREE_HALVES, z, need)
      const m = scaleByExact(s.S, s.log2R, s.F, x)
      const cv = roundFixedFast(m.M, m.log2R, m.F, d)
      const kappa = m.M === 0n ? null : formatKappa(Math.abs(1 + 2 * ratio(s.W, s.S)))
      if (!odd || cv.digits > odd.digits) odd = { ...cv, kappa }
    }
    if (even.digits >= d && odd.digits >= d) break
  }
  return { even: even!, odd: odd! }
}

export { log2Abs }
