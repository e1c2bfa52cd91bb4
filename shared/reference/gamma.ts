/**
 * 1/Γ(x) for real x in Decimal, needed by the parabolic cylinder function.
 *
 * Method: for x ≥ X0 (≈ 0.8·precision + 10), Stirling's series
 *   ln Γ(x) = (x − ½) ln x − x + ½ ln 2π + Σ_{k≥1} B_{2k} / (2k(2k−1) x^{2k−1})
 * (DLMF 5.11.1), summed until a term falls below the working precision; for
 * smaller x the recurrence Γ(x) = Γ(x + N)/(x(x+1)…(x+N−1)) (DLMF 5.5.1); for
 * x < ½ the reflection 1/Γ(x) = Γ(1 − x) sin(πx)/π (DLMF 5.5.3).
 * Special values: 1/Γ(x) = 0 exactly at x = 0, −1, −2, ….
 * Accuracy: no rigorous bound is carried here; callers certify by comparing
 * two working precisions.
 * Bernoulli numbers are exact rationals from Σ_{j=0}^{m} C(m+1, j) B_j = 0.
 */
import type Decimal from 'decimal.js'
import { pi, type DecimalCtor } from '../numeric/decimal'

const BERN: Array<[bigint, bigint]> = [[1n, 1n]] // B_0, B_1, … as num/den

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a
  while (b) { const t = a % b; a = b; b = t }
  return a
}

function bernoulli(m: number): [bigint, bigint] {
  while (BERN.length <= m) {
    const n = BERN.length
    // B_n = −1/(n+1) Σ_{j<n} C(n+1, j) B_j
    let num = 0n, den = 1n, binom = 1n
    for (let j = 0; j < n; j++) {
      const [bn, bd] = BERN[j]!
      num = num * bd + binom * bn * den
      den *= bd
      const g = gcd(num, den)
      num /= g; den /= g
      binom = binom * BigInt(n + 1 - j) / BigInt(j + 1)
    }
    den *= -BigInt(n + 1)
    if (den < 0n) { num = -num; den = -den }
    const g = gcd(num, den)
    BERN.push([num / g, den / g])
  }
  return BERN[m]!
}

function lnGammaLarge(x: Decimal, D: DecimalCtor): Decimal {
  const half = new D('0.5')
  let s = x.minus(half).times(x.ln()).minus(x).plus(pi(D).times(2).ln().times(half))
  const x2 = x.times(x)
  let xp = x
  const eps = new D(10).pow(-D.precision - 2)
  for (let k = 1; k < 2000; k++) {
    const [bn, bd] = bernoulli(2 * k)
    const term = new D(bn.toString()).div(new D((bd * BigInt(2 * k * (2 * k - 1))).toString()).times(xp))
    s = s.plus(term)
    if (term.abs().lt(eps)) break
    xp = xp.times(x2)
  }
  return s
}

export function recipGamma(x: Decimal, D: DecimalCtor): Decimal {
  if (x.isInteger() && x.lte(0)) return new D(0)
  if (x.lt(0.5)) {
    // 1/Γ(x) = Γ(1−x) sin(πx) / π
    const one = new D(1)
    const g = new D(1).div(recipGamma(one.minus(x), D))
    return g.times(pi(D).times(x).sin()).div(pi(D))
  }
  const X0 = Math.ceil(0.8 * D.precision) + 10
  let shift = new D(1)
  let y = x
  while (y.lt(X0)) { shift = shift.times(y); y = y.plus(1) }
  return shift.div(lnGammaLarge(y, D).exp())
}
