// Deviation rules, pure: a deviation's standing, whether it applies to a
// version, which deviation takes a failing case, and the counts that follow.
//
// Decisions (kept here so the server, the record and the pages agree):
// - Only `fail` verdicts can be accepted. A non-finite, missing, unexpected
//   or duplicate result carries no measured error to bound, so no deviation
//   covers it; it stays a failure.
// - An expiry date ends the deviation for every version once the date has
//   passed (judged when read). An expiry version ends it for that version
//   and every later one in the code's version order; earlier versions keep it.
// - When several apply to one case, the narrowest wins (case, then region,
//   then set), and among equals the oldest (lowest id).
import { compareVersions, type Orderable } from './versions'
import type { Verdict } from './enums'

export const DEVIATION_SCOPES = ['case', 'region', 'set'] as const
export type DeviationScope = (typeof DEVIATION_SCOPES)[number]
export const DEVIATION_STATES = ['proposed', 'approved', 'rejected', 'withdrawn', 'expired'] as const
export type DeviationState = (typeof DEVIATION_STATES)[number]

/** The verdicts a deviation can turn into `accepted`. */
export const ACCEPTABLE_VERDICTS: readonly Verdict[] = ['fail']

export interface DeviationRule {
  id: number
  scope: DeviationScope
  caseInputKey: string | null
  region: string | null
  state: DeviationState
  expiresAtVersion: string | null
  expiresOn: Date | string | null
}

const time = (d: Date | string) => new Date(d).getTime()

/** True once the expiry date has passed. */
export function expiredByDate(d: Pick<DeviationRule, 'expiresOn'>, now: Date): boolean {
  return d.expiresOn !== null && time(d.expiresOn) <= now.getTime()
}

/** The stored state, or `expired` for an approved deviation whose date has passed. */
export function standing(d: Pick<DeviationRule, 'state' | 'expiresOn'>, now: Date): DeviationState {
  return d.state === 'approved' && expiredByDate(d, now) ? 'expired' : d.state
}

/**
 * The expiry label as a point in the code's version order: the version of
 * that label when it exists, else a version made after every existing one.
 */
function expiryPoint(label: string, versions: readonly Orderable[]): Orderable {
  return versions.find(v => v.label === label) ?? { label, createdAt: new Date(8.64e15), id: Number.MAX_SAFE_INTEGER }
}

/** True when `version` is at or after the deviation's expiry version. */
export function expiredForVersion(d: Pick<DeviationRule, 'expiresAtVersion'>, version: Orderable, versions: readonly Orderable[]): boolean {
  if (!d.expiresAtVersion) return false
  return compareVersions(version, expiryPoint(d.expiresAtVersion, versions)) >= 0
}

export type VersionStanding = 'applies' | 'not-approved' | 'expired-by-date' | 'expired-by-version'

/** Whether an (approved, unexpired) deviation applies to runs of `version`, and if not, why. */
export function standingForVersion(d: DeviationRule, version: Orderable, versions: readonly Orderable[], now: Date): VersionStanding {
  if (d.state !== 'approved') return 'not-approved'
  if (expiredByDate(d, now)) return 'expired-by-date'
  if (expiredForVersion(d, version, versions)) return 'expired-by-version'
  return 'applies'
}

const RANK: Record<DeviationScope, number> = { case: 0, region: 1, set: 2 }

/** Deviations in the order they claim a case: narrowest scope first, then oldest. */
export function precedenceOrder<T extends Pick<DeviationRule, 'id' | 'scope'>>(list: readonly T[]): T[] {
  return [...list].sort((a, b) => RANK[a.scope] - RANK[b.scope] || a.id - b.id)
}

export type MatchStep =
  | { deviationId: number, kind: 'case', inputKey: string }
  | { deviationId: number, kind: 'region', region: string }
  | { deviationId: number, kind: 'set' }

/**
 * How to find the deviation that accepts a failing case: try each step in
 * order, the first that matches takes it. Nothing after a set-wide step can
 * match, so the plan stops there.
 */
export function matchPlan(applicable: readonly DeviationRule[]): MatchStep[] {
  const steps: MatchStep[] = []
  for (const d of precedenceOrder(applicable)) {
    if (d.scope === 'case' && d.caseInputKey) steps.push({ deviationId: d.id, kind: 'case', inputKey: d.caseInputKey })
    else if (d.scope === 'region' && d.region) steps.push({ deviationId: d.id, kind: 'region', region: d.region })
    else if (d.scope === 'set') {
      steps.push({ deviationId: d.id, kind: 'set' })
      break
    }
  }
  return steps
}

type Counts = Partial<Record<Verdict, number>>

/** Counts with `accepted` failures moved from `fail` to `accepted`. */
export function withAccepted<C extends Counts>(counts: C, accepted: number): C {
  if (accepted <= 0) return counts
  const fail = counts.fail ?? 0
  const n = Math.min(accepted, fail)
  return { ...counts, fail: fail - n, accepted: (counts.accepted ?? 0) + n }
}
