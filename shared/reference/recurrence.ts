/**
 * Fixed-point core for the three-term recurrences of H_n and He_n, with a
 * rigorous running error bound.
 *
 *   H:  y_{k+1} = 2x y_k − 2k y_{k−1},  y_0 = 1, y_1 = 2x   (DLMF 18.9.1, Table 18.9.1)
 *   He: y_{k+1} =  x y_k −  k y_{k−1},  y_0 = 1, y_1 = x
 *
 * Values are BigInt multiples of u = 2^−F. x̃ = floor(x·2^F)·u, so
 * |x − x̃| < u (zero when x is dyadic). Each product is floored, adding an
 * error in (−u, 0]. The error e_k of y_k against y_k(x̃) obeys the same
 * recurrence plus that error, so in units of u
 *   |e_k| ≤ E_k,  E_{k+1} = c·X·E_k + c2(k)·E_{k−1} + 1,  E_0 = E_1 = 0,
 * with X ≥ |x| + u. For the input error, |y_k(x) − y_k(x̃)| ≤ u·c2(k)·A_{k−1} (c2(k)·A_{k−1} units),
 * where A_{k+1} = c·X·A_k + c2(k)·A_{k−1} (A_0 = 1, A_1 = cX) bounds |y_k| on
 * [−X, X] (triangle inequality), since y_k' = c2(k) y_{k−1} (DLMF 18.9.25).
 * E and A are run in doubles with a shared power-of-two scale and the final
 * log2 bound is inflated by far more than the doubles' own rounding.
 */
import { toFixedPoint, approxNumber, toRational, type ExactDecimal } from '../numeric/exact'
import { log2Add } from '../numeric/bits'

export type Family = 'H' | 'He'

export interface RecurrenceRun {
  F: number
  /** y_k · 2^F for k = 0…n. */
  M: bigint[]
  /** log2 of the error radius of M[k], in units of 2^−F (−Infinity: exact). */
  log2R: number[]
  /** log2 of A_k, the bound on |y_k| over [−X, X] (only when asked for). */
  log2A?: number[]
}

const RESCALE = 2 ** 800

/**
 * With `visit`, each y_k is handed over as it is made and nothing is stored
 * (M and log2R stay empty): batch tables keep little alive, so the garbage
 * collector has little to do.
 */
export function runRecurrence(
  family: Family, x: ExactDecimal, n: number, F: number,
  visit?: (k: number, M: bigint, log2R: number, Fk: number) => void,
): RecurrenceRun {
  const { v: X, exact } = toFixedPoint(x, F)
  const xa = Math.abs(approxNumber(x)) * (1 + 2 ** -40) + 2 ** -Math.min(F, 1000)
  const { num, den } = toRational(x)
  // A short decimal x = p/q runs exactly as (c·p·y)/q: cheaper than a full
  // fixed-point product, and no input error at all.
  if (num < RATIONAL_LIMIT && num > -RATIONAL_LIMIT && den < RATIONAL_LIMIT) {
    return runRecurrenceFixed(family, X, 0, xa, n, F, false, { p: num, q: den }, visit)
  }
  return runRecurrenceFixed(family, X, exact ? 0 : 1, xa, n, F, false, undefined, visit)
}

const RATIONAL_LIMIT = 1n << 64n

/**
 * The recurrence at x̃ = X·2^−F for an x with |x − x̃| ≤ delta units
 * (delta = 0: x̃ is x), xa ≥ |x| + delta·2^−F.
 */
export function runRecurrenceFixed(
  family: Family, X: bigint, delta: number, xa: number, n: number, F: number, keepA = false,
  rational?: { p: bigint; q: bigint },
  visit?: (k: number, M: bigint, log2R: number, Fk: number) => void,
): RecurrenceRun {
  const exact = delta === 0
  const shift = BigInt(family === 'H' ? F - 1 : F)
  const c = family === 'H' ? 2 : 1
  const one = 1n << BigInt(F)
  const M: bigint[] = new Array(n + 1)
  const log2R: number[] = new Array(n + 1)
  M[0] = one
  log2R[0] = -Infinity
  const log2A: number[] | undefined = keepA ? new Array(n + 1) : undefined
  if (n === 0) { visit?.(0, one, -Infinity, F); return { F, M, log2R, log2A } }
  const cP = rational ? (family === 'H' ? 2n : 1n) * rational.p : 0n
  const Q = rational ? rational.q : 1n
  const y1 = rational ? (cP * one) / Q : family === 'H' ? 2n * X : X
  if (!visit) M[1] = y1
  // While every product is exact (dyadic x, e.g. 0 or 0.5) no error is added.
  let exactSoFar = exact && (!rational || y1 * Q === cP * one)
  // Scaled bounds: E (units) = Ê·2^scE, A (real) = Â·2^scA.
  let scE = 0, scA = 0
  let Ep = 0, E = 0, Ap = 1, A = c * xa
  if (rational && !exactSoFar) E = 1 // y_1 itself was truncated
  log2R[1] = rational ? (exactSoFar ? -Infinity : 0) : exact ? -Infinity : Math.log2(c * delta) // y_1' = c
  if (log2A) { log2A[0] = 0; log2A[1] = Math.log2(c * xa) + 1e-9 }
  if (visit) { visit(0, one, -Infinity, F); visit(1, y1, log2R[1]!, F) }
  let yp = one, y = y1
  for (let k = 1; k < n; k++) {
    const c2 = family === 'H' ? 2 * k : k
    const c2b = BigInt(c2)
    let q: bigint
    if (rational) {
      const prod = cP * y
      q = prod / Q
      if (exactSoFar && q * Q !== prod) exactSoFar = false
    } else {
      const prod = X * y
      q = prod >> shift
      if (exactSoFar && (q << shift) !== prod) exactSoFar = false
    }
    const next = q - c2b * yp
    yp = y
    y = next
    if (!visit) M[k + 1] = next
    // 2^−scE may underflow once scE > 1074; it is then far below Ê's own
    // rounding, which the final margin covers.
    const tiny = exactSoFar ? 0 : 2 ** -scE
    const En = c * xa * E + c2 * Ep + tiny
    const An = c * xa * A + c2 * Ap
    Ep = E; E = En; Ap = A; A = An
    if (E > RESCALE) { E /= RESCALE; Ep /= RESCALE; scE += 800 }
    if (A > RESCALE) { A /= RESCALE; Ap /= RESCALE; scA += 800 }
    if (log2A) log2A[k + 1] = Math.log2(A) + scA + 1e-9 + (k + 1) * 1e-13
    // Radius of y_{k+1} in units: E_{k+1} + c2(k+1)·A_k (the latter only if x̃ ≠ x).
    const c2n = family === 'H' ? 2 * (k + 1) : k + 1
    let l = E > 0 ? Math.log2(E) + scE : -Infinity
    if (!exact) l = log2Add(l, Math.log2(c2n * Ap * delta) + scA)
    const lr = l === -Infinity ? l : l + 1e-9 + (k + 1) * 1e-13
    if (!visit) { log2R[k + 1] = lr; continue }
    visit(k + 1, next, lr, F)
  }
  return { F, M, log2R, log2A }
}

/**
 * Bits of cancellation to expect at x for degrees up to n: the largest
 * log2(A_k / amplitude_k), with amplitude_k = sqrt(y_k² + c2(k)/c·y_{k−1}²)
 * from a double-precision pass (an estimate only; the bound decides).
 */
export function cancellationBits(family: Family, x: ExactDecimal, n: number): number {
  const xv = approxNumber(x)
  const c = family === 'H' ? 2 : 1
  const xa = Math.abs(xv)
  let hp = 1, h = c * xv, Ap = 1, A = c * xa, worst = 0
  for (let k = 1; k < n; k++) {
    const c2 = family === 'H' ? 2 * k : k
    const hn = c * xv * h - c2 * hp
    const An = c * xa * A + c2 * Ap
    hp = h; h = hn; Ap = A; A = An
    const amp = Math.sqrt(h * h + ((c2 + (family === 'H' ? 2 : 1)) / c) * hp * hp)
    const lost = Math.log2(A / amp)
    if (amp > 0 && Number.isFinite(lost)) worst = Math.max(worst, lost)
    if (A > 1e150) { A /= 1e150; Ap /= 1e150; h /= 1e150; hp /= 1e150 } // squares stay finite
  }
  return Math.ceil(worst) + Math.ceil(Math.log2(n + 2)) + 4
}

/**
 * Exact evaluation for a decimal x = p/q (q a power of ten): z_k = q^k y_k(x)
 * is an integer with z_{k+1} = c·p·z_k − c2(k)·q²·z_{k−1}. The fallback when
 * an enclosure sits on a rounding tie. Returns y_n = sign·coef·10^exp.
 */
export function exactRecurrence(family: Family, x: ExactDecimal, n: number): { neg: boolean; coef: bigint; exp: number } {
  const { num, den } = toRational(x)
  const c = family === 'H' ? 2n : 1n
  const q2 = den * den
  let zp = 1n, z = c * num
  if (n === 0) z = 1n
  for (let k = 1; k < n; k++) {
    const c2 = BigInt(family === 'H' ? 2 * k : k)
    const zn = c * num * z - c2 * q2 * zp
    zp = z; z = zn
  }
  const m = x.exp < 0 ? -x.exp : 0
  return { neg: z < 0n, coef: z < 0n ? -z : z, exp: -m * n }
}
