/**
 * Hermite polynomials H_n(x) (physicists', `hermite`) and He_n(x)
 * (probabilists', `hermite-prob`), and d^k/dx^k H_n (`hermite-derivative`).
 *
 * Definition: DLMF 18.3 (Table 18.3.1); H_n orthogonal for e^{−x²},
 *   He_n for e^{−x²/2}; He_n(x) = 2^{−n/2} H_n(x/√2) (DLMF 18.7.11).
 * Method: forward three-term recurrence in BigInt fixed point with a
 *   rigorous error bound (recurrence.ts). The working precision starts at
 *   the target plus guard bits plus the expected cancellation and is raised
 *   until the enclosure rounds to the target digits.
 * Derivative: d^k/dx^k H_n = 2^k n!/(n−k)! H_{n−k}(x) (DLMF 18.9.25), an exact
 *   integer factor; zero for k > n.
 * Special values: x = 0 runs exactly (H_n(0) = 0 for odd n, exact zero).
 * Accuracy: every returned digit is the exact value correctly rounded
 *   (certified by the rigorous bound); relative, so points near zeros of H_n
 *   get full relative accuracy at the cost of more working bits.
 * κ = |x y_n'/y_n| with y_n' = c2(n) y_{n−1}, from the certified enclosures.
 */
import { DomainError, isZero, type ExactDecimal } from '../numeric/exact'
import { bitLength, factorial, log2Abs } from '../numeric/bits'
import { roundFixedFast, roundExact, bitsFor, type CertifiedValue } from './certify'
import { runRecurrence, cancellationBits, exactRecurrence, type Family, type RecurrenceRun } from './recurrence'

export interface ScalarResult extends CertifiedValue {
  /** Relative condition number, 4 significant digits; null where undefined. */
  kappa: string | null
}

export const MAX_DEGREE = 20000
const MAX_RETRIES = 4

function relBits(run: RecurrenceRun, k: number): number {
  return log2Abs(run.M[k]!) - run.log2R[k]!
}

export function formatKappa(v: number): string | null {
  if (!Number.isFinite(v)) return null
  return v === 0 ? '0' : v.toPrecision(4).replace(/e\+?/, 'e+').replace('e+-', 'e-')
}

/** κ from y_n and y_{n−1} enclosures, only if both hold ≥ 20 bits. */
function kappaOf(run: RecurrenceRun, family: Family, x: ExactDecimal, n: number): string | null {
  if (n === 0) return '0'
  if (run.M[n] === 0n || relBits(run, n) < 20 || relBits(run, n - 1) < 20) return null
  if (isZero(x)) return '0'
  const c2 = family === 'H' ? 2 * n : n
  const l = Math.log2(Math.abs(Number(`${x.coef}e${x.exp}`))) + Math.log2(c2) +
    log2Abs(run.M[n - 1]!) - log2Abs(run.M[n]!)
  return formatKappa(2 ** l)
}

/**
 * y_n at one x, certified to d digits where possible. `scale` multiplies the
 * result exactly (used by the derivative rule).
 */
export function evalHermiteFamily(
  family: Family, n: number, x: ExactDecimal, d: number, scale = 1n,
): ScalarResult & { run: RecurrenceRun } {
  let F = bitsFor(d) + cancellationBits(family, x, n)
  let best: (ScalarResult & { run: RecurrenceRun }) | null = null
  for (let attempt = 0; attempt <= MAX_RETRIES; attempt++) {
    const run = runRecurrence(family, x, Math.max(n, 1), F)
    const cv = roundFixedFast(run.M[n]! * scale, run.log2R[n]! + log2Abs(scale) + 1e-12, F, d)
    const res = { ...cv, kappa: kappaOf(run, family, x, n), run }
    if (!best || cv.digits > best.digits) best = res
    if (cv.digits >= d) return res
    const have = run.M[n] === 0n ? 0 : Math.max(0, relBits(run, n))
    if (have > bitsFor(d, 8) && attempt >= 1) break // a rounding tie: settle it exactly
    F += Math.max(32, Math.ceil(bitsFor(d) - have) + 16)
  }
  const ex = exactRecurrence(family, x, n)
  const cv = roundExact(ex.neg, ex.coef * scale, ex.exp, d)
  return { ...cv, kappa: best!.kappa, run: best!.run }
}

/** Check n against the catalogue domain. */
export function checkDegree(n: number): void {
  if (n > MAX_DEGREE) throw new DomainError(`n must be at most ${MAX_DEGREE}`, 'n')
}

export function hermite(n: number, x: ExactDecimal, d: number): ScalarResult {
  checkDegree(n)
  const { run: _run, ...r } = evalHermiteFamily('H', n, x, d)
  return r
}

export function hermiteProb(n: number, x: ExactDecimal, d: number): ScalarResult {
  checkDegree(n)
  const { run: _run, ...r } = evalHermiteFamily('He', n, x, d)
  return r
}

export function hermiteDerivative(n: number, k: number, x: ExactDecimal, d: number): ScalarResult {
  checkDegree(n)
  if (k > n) return { value: '0', digits: d, exact: true, kappa: null }
  const m = n - k
  const scale = (1n << BigInt(k)) * (factorial(n) / factorial(m))
  const { run: _run, ...r } = evalHermiteFamily('H', m, x, d, scale)
  return r
}

/**
 * The whole table y_0 … y_nMax at many x (batch use: reference sets that
 * sweep n). One recurrence per x; a row is rerun at more bits only if some
 * entry fails to reach d digits.
 */
export function hermiteTable(family: Family, nMax: number, xs: ExactDecimal[], d: number): CertifiedValue[][] {
  checkDegree(nMax)
  return xs.map((x) => {
    let F = bitsFor(d) + cancellationBits(family, x, nMax)
    let out: CertifiedValue[] = []
    for (let attempt = 0; attempt <= MAX_RETRIES; attempt++) {
      out = new Array(nMax + 1)
      let worst = Infinity
      let failed = false
      runRecurrence(family, x, Math.max(nMax, 1), F, (k, M, log2R, Fk) => {
        if (k > nMax) return
        const cv = roundFixedFast(M, log2R, Fk, d)
        out[k] = cv
        if (cv.digits < d) {
          failed = true
          worst = Math.min(worst, M === 0n ? 0 : log2Abs(M) - log2R)
        }
      })
      if (!failed) return out
      if (worst > bitsFor(d, 8) && attempt >= 1) break
      F += Math.max(32, Math.ceil(bitsFor(d) - Math.max(0, worst)) + 16)
    }
    // Entries still short of d digits sit on rounding ties: settle exactly.
    return out.map((cv, k) => {
      if (cv.digits >= d) return cv
      const ex = exactRecurrence(family, x, k)
      return roundExact(ex.neg, ex.coef, ex.exp, d)
    })
  })
}

export { bitLength }
