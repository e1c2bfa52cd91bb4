// When is a run a regression? Plainly: compared with the latest run of the
// nearest earlier version (in release order, shared/domain/versions.ts) that
// was judged against the same reference set (same slug, any revision), the
// new run is worse when
//   (a) any case — matched by its exact inputs — that the earlier run passed
//       (or accepted) now fails in any way (fail, missing, non-finite,
//       duplicate), or
//   (b) it has more failing cases in total than the earlier run had
//       (this also catches runs whose per-case results are not comparable,
//       e.g. when the set's revision changed the cases).
// A first run on a set (no earlier version has one) is never a regression.

export interface RegressionEvidence {
  previousRunId: number
  /** Cases the earlier run passed that the new run fails. */
  newlyFailing: number
  failuresBefore: number
  failuresAfter: number
}

export function isWorse(e: RegressionEvidence): boolean {
  return e.newlyFailing > 0 || e.failuresAfter > e.failuresBefore
}

export const REGRESSION_RULE = 'A run is a regression when a case the previous version passed on the same reference set now fails, or when it has more failing cases than that run.'
