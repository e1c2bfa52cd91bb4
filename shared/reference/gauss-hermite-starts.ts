/**
 * Double-precision starting values for the positive zeros of H_n.
 * The normalised recurrence ψ̃_{k+1} = √(2/(k+1)) x ψ̃_k − √(k/(k+1)) ψ̃_{k−1}
 * (ψ̃ = ψ_k without its e^{−x²/2} factor, rescaled as it grows) has the signs
 * of H_k. All zeros lie below √(2n+1) (common practice: the turning point
 * bound), so a grid finer than the smallest spacing (≈ π/√(2n+1)) finds each
 * sign change; bisection then pins each to double precision. The count is
 * checked against ⌊n/2⌋ and the grid refined if one was missed.
 */

function signValue(n: number, x: number): number {
  let pp = 1, p = Math.SQRT2 * x
  if (n === 0) return 1
  for (let k = 1; k < n; k++) {
    const next = Math.sqrt(2 / (k + 1)) * x * p - Math.sqrt(k / (k + 1)) * pp
    pp = p; p = next
    const a = Math.abs(p)
    if (a > 1e200) { p /= 1e200; pp /= 1e200 }
  }
  return p
}

export function positiveZerosDouble(n: number): number[] {
  const want = Math.floor(n / 2)
  const top = Math.sqrt(2 * n + 1) + 1
  for (let fine = 8; fine <= 256; fine *= 4) {
    const h = Math.PI / Math.sqrt(2 * n + 1) / fine
    const zeros: number[] = []
    let a = n % 2 ? h / 2 : 0
    let fa = signValue(n, a)
    for (let b = a + h; a < top && zeros.length < want; a = b, b += h) {
      const fb = signValue(n, b)
      if (fa === 0) { zeros.push(a) } else if ((fa < 0) !== (fb < 0)) {
        let lo = a, hi = b, flo = fa
        for (let it = 0; it < 80 && hi - lo > 0; it++) {
          const mid = (lo + hi) / 2
          if (mid === lo || mid === hi) break
          const fm = signValue(n, mid)
          if ((fm < 0) === (flo < 0)) { lo = mid; flo = fm } else hi = mid
        }
        zeros.push((lo + hi) / 2)
      }
      fa = fb
    }
    if (zeros.length === want) return zeros
  }
  throw new Error(`gauss-hermite: could not bracket the zeros of H_${n}`)
}

/** Cancellation bits of H_n at x (estimate), as in recurrence.ts. */
export function cancellationBitsAt(x: number, n: number): number {
  let hp = 1, h = 2 * x, Ap = 1, A = 2 * Math.abs(x), worst = 0
  for (let k = 1; k < n; k++) {
    const hn = 2 * x * h - 2 * k * hp
    const An = 2 * Math.abs(x) * A + 2 * k * Ap
    hp = h; h = hn; Ap = A; A = An
    const amp = Math.sqrt(h * h + (k + 1) * hp * hp)
    const lost = Math.log2(A / amp)
    if (amp > 0 && Number.isFinite(lost)) worst = Math.max(worst, lost)
    if (A > 1e150) { A /= 1e150; Ap /= 1e150; h /= 1e150; hp /= 1e150 } // squares stay finite
  }
  return Math.ceil(worst) + Math.ceil(Math.log2(n + 2)) + 4
}
