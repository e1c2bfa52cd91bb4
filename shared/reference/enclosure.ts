/**
 * Enclosures of y_n(x) (H or He) raised to a requested number of relative
 * bits, for the functions built on top of the polynomials.
 */
import type { ExactDecimal } from '../numeric/exact'
import { log2Abs } from '../numeric/bits'
import { runRecurrence, cancellationBits, type Family, type RecurrenceRun } from './recurrence'

export function relBitsOf(run: RecurrenceRun, k: number): number {
  return run.M[k] === 0n ? (run.log2R[k] === -Infinity ? Infinity : 0) : log2Abs(run.M[k]!) - run.log2R[k]!
}

/** Run until y_n carries at least needBits relative bits (or give the best). */
export function polynomialEnclosure(family: Family, n: number, x: ExactDecimal, needBits: number): RecurrenceRun {
  let F = needBits + 8 + cancellationBits(family, x, n)
  let run = runRecurrence(family, x, Math.max(n, 1), F)
  for (let attempt = 0; attempt < 5 && relBitsOf(run, n) < needBits; attempt++) {
    F += Math.max(32, Math.ceil(needBits - Math.max(0, relBitsOf(run, n))) + 16)
    run = runRecurrence(family, x, Math.max(n, 1), F)
  }
  return run
}

/** Relative radius of y_k as a double (Infinity when the sign is unproven). */
export function relRadius(run: RecurrenceRun, k: number): number {
  const b = relBitsOf(run, k)
  return b === Infinity ? 0 : 2 ** -b
}
