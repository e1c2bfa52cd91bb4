import type { Verdict } from './enums'

/** State of one board cell: a code version against one reference set. */
export type CellState = 'passed' | 'failed' | 'accepted' | 'unverified' | 'stale'

export const CELL_LABELS: Record<CellState, string> = {
  passed: 'passed',
  failed: 'failed',
  accepted: 'passed with accepted deviations',
  unverified: 'not yet verified',
  stale: 'stale: judged against an older revision',
}

type Counts = Partial<Record<Verdict, number>>

export const FAILING: Verdict[] = ['fail', 'missing', 'unexpected', 'non_finite', 'duplicate']

export function failures(counts: Counts): number {
  return FAILING.reduce((s, v) => s + (counts[v] ?? 0), 0)
}

/**
 * A cell's state from the latest run (if any): the revision it was judged
 * against, the set's current revision, and its verdict counts.
 */
export function cellState(run: { revision: number, counts: Counts } | null, currentRevision: number): CellState {
  if (!run) return 'unverified'
  if (run.revision < currentRevision) return 'stale'
  if (failures(run.counts) > 0) return 'failed'
  if ((run.counts.accepted ?? 0) > 0) return 'accepted'
  return 'passed'
}
