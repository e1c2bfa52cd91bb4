/**
 * Orthonormal Hermite function ψ_n(x) = (2^n n! √π)^{−1/2} e^{−x²/2} H_n(x)
 * (`hermite-function`), the harmonic-oscillator eigenfunction; ∫ψ_n² dx = 1
 * (normalisation from DLMF 18.3, Table 18.3.1: h_n = 2^n n! √π).
 *
 * Method: H_n(x) by the certified fixed-point recurrence (which cannot
 *   overflow: BigInt), then the normalisation and e^{−x²/2} in Decimal at
 *   the target plus 15 guard digits. The fixed-point form of the normalised
 *   recurrence would underflow for values like ψ_400(45) ≈ 5e−163, so the
 *   scaling is applied once at the end instead.
 * Error budget: the rigorous relative radius of H_n plus 10 ulps for the
 *   handful of correctly rounded Decimal steps (π by Machin, exp, sqrt, ×, ÷).
 * Special values: ψ_n(0) = 0 exactly for odd n.
 * Accuracy: returned digits are the exact value correctly rounded.
 * κ = |x(2n H_{n−1}/H_n − x)|, from ψ_n' = √(2n) ψ_{n−1} − x ψ_n.
 */
import { mul, halve, negate, approxNumber, type ExactDecimal } from '../numeric/exact'
import { factorial } from '../numeric/bits'
import { decimalClone, exactToDecimal, fixedToDecimal, pi, ulps } from '../numeric/decimal'
import { roundDecimalBall, bitsFor } from './certify'
import { polynomialEnclosure, relRadius } from './enclosure'
import { ratio } from './kummer'
import { checkDegree, formatKappa, type ScalarResult } from './hermite'

export function hermiteFunction(n: number, x: ExactDecimal, d: number): ScalarResult {
  checkDegree(n)
  let guard = 15
  let best: ScalarResult | null = null
  for (let attempt = 0; attempt < 4; attempt++, guard += 20) {
    const run = polynomialEnclosure('H', n, x, bitsFor(d + guard - 5))
    const Mn = run.M[n]!
    if (Mn === 0n && run.log2R[n] === -Infinity) return { value: '0', digits: d, exact: true, kappa: null }
    const D = decimalClone(d + guard)
    const h = fixedToDecimal(Mn, run.F, D)
    const e = D.exp(exactToDecimal(negate(halve(mul(x, x))), D))
    const norm = new D((factorial(n) << BigInt(n)).toString()).times(pi(D).sqrt()).sqrt()
    const v = h.times(e).div(norm)
    const cv = roundDecimalBall(v, relRadius(run, n) + ulps(D, 10), d)
    const xv = approxNumber(x)
    const kappa = n === 0 ? formatKappa(xv * xv)
      : Mn === 0n ? null : formatKappa(Math.abs(xv * (2 * n * ratio(run.M[n - 1]!, Mn) - xv)))
    const res = { ...cv, kappa }
    if (!best || cv.digits > best.digits) best = res
    if (cv.digits >= d) return res
  }
  return best!
}
