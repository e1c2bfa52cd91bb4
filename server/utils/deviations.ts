// Deviations at read time: which approved deviations apply to a run, and
// which of its failing case results each one accepts. Nothing is written:
// case_results keeps the verdict the run was judged with, and the counts,
// the board and the case table show `accepted` from the rules in
// shared/domain/deviations.ts.
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm'
import { cellState } from '../../shared/domain/board'
import { expiredByDate, matchPlan, standingForVersion, withAccepted } from '../../shared/domain/deviations'
import type { Verdict } from '../../shared/domain/enums'
import type { AppliedDeviation, RunDetail } from '../../shared/domain/api-types'
import type { Deviation } from '../database/schema'

type Counts = Partial<Record<Verdict, number>>

/** A run as the deviation rules need it. */
export interface DeviationRunRef { id: number, versionId: number, setId: number, setSlug: string }

/** The SQL that gives each case result of a run the id of the deviation that accepts it (else NULL), and its verdict as shown. */
export interface DeviationColumns { acceptedBy: SQL<number | null>, verdict: SQL<Verdict> }

const r = () => schema.caseResults

export const plainDeviationColumns = (): DeviationColumns => ({
  acceptedBy: sql<number | null>`NULL`,
  verdict: sql<Verdict>`${r().verdict}`,
})

/** Approved, unexpired deviations that apply to each run (runs with none are left out). */
export async function applicableDeviations(runs: readonly DeviationRunRef[], now = new Date()): Promise<Map<number, Deviation[]>> {
  const out = new Map<number, Deviation[]>()
  const slugs = [...new Set(runs.map(x => x.setSlug))]
  if (!slugs.length) return out
  const db = useDb()
  const { deviations, versions } = schema
  const approved = await db.select().from(deviations).where(and(eq(deviations.state, 'approved'), inArray(deviations.setSlug, slugs)))
  const live = approved.filter(d => !expiredByDate(d, now))
  if (!live.length) return out
  const codeIds = [...new Set(live.map(d => d.codeId))]
  const vs = await db.select({ id: versions.id, codeId: versions.codeId, label: versions.label, createdAt: versions.createdAt }).from(versions).where(inArray(versions.codeId, codeIds))
  const byId = new Map(vs.map(v => [v.id, v]))
  for (const run of runs) {
    const v = byId.get(run.versionId)
    if (!v) continue
    const ofCode = vs.filter(x => x.codeId === v.codeId)
    const list = live.filter(d => d.codeId === v.codeId && d.setSlug === run.setSlug && standingForVersion(d, v, ofCode, now) === 'applies')
    if (list.length) out.set(run.id, list)
  }
  return out
}

/** A CASE expression over case_results: the accepting deviation's id for a failing result of set revision `setId`, else NULL. */
async function acceptedByExpression(applied: readonly Deviation[], setId: number): Promise<SQL<number | null> | null> {
  const plan = matchPlan(applied)
  const keys = plan.flatMap(s => (s.kind === 'case' ? [s.inputKey] : []))
  const caseIds = new Map<string, number>()
  if (keys.length) {
    const rows = await useDb().select({ id: schema.cases.id, key: schema.cases.inputKey }).from(schema.cases)
      .where(and(eq(schema.cases.setId, setId), inArray(schema.cases.inputKey, keys)))
    for (const row of rows) caseIds.set(row.key, row.id)
  }
  const whens: SQL[] = []
  for (const step of plan) {
    if (step.kind === 'set') whens.push(sql`WHEN TRUE THEN ${step.deviationId}`)
    else if (step.kind === 'region') whens.push(sql`WHEN ${r().region} = ${step.region} THEN ${step.deviationId}`)
    else if (caseIds.has(step.inputKey)) whens.push(sql`WHEN ${r().caseId} = ${caseIds.get(step.inputKey)} THEN ${step.deviationId}`)
  }
  if (!whens.length) return null
  return sql<number | null>`(CASE WHEN ${r().verdict} = 'fail' THEN (CASE ${sql.join(whens, sql` `)} END) END)`.mapWith(Number)
}

/** The deviations that apply to one run, and the columns that show them. */
export async function runDeviationColumns(run: DeviationRunRef): Promise<{ applied: Deviation[], columns: DeviationColumns }> {
  const applied = (await applicableDeviations([run])).get(run.id) ?? []
  const acceptedBy = applied.length ? await acceptedByExpression(applied, run.setId) : null
  if (!acceptedBy) return { applied, columns: plainDeviationColumns() }
  return {
    applied,
    columns: { acceptedBy, verdict: sql<Verdict>`(CASE WHEN ${acceptedBy} IS NOT NULL THEN 'accepted' ELSE ${r().verdict} END)` },
  }
}

/** For the board: each run's counts with accepted failures moved to `accepted` (runs without any keep theirs and are left out). */
export async function countsWithDeviations(runs: ReadonlyArray<DeviationRunRef & { counts: Counts }>): Promise<Map<number, Counts>> {
  const out = new Map<number, Counts>()
  const failing = runs.filter(x => (x.counts.fail ?? 0) > 0)
  const applicable = await applicableDeviations(failing)
  const groups = new Map<string, { setId: number, applied: Deviation[], runs: typeof failing }>()
  for (const run of failing) {
    const applied = applicable.get(run.id)
    if (!applied) continue
    const key = `${run.setId}:${applied.map(d => d.id).sort((a, b) => a - b).join(',')}`
    const g = groups.get(key) ?? { setId: run.setId, applied, runs: [] }
    g.runs.push(run)
    groups.set(key, g)
  }
  for (const g of groups.values()) {
    const expr = await acceptedByExpression(g.applied, g.setId)
    if (!expr) continue
    const rows = await useDb().select({ runId: r().runId, n: sql<number>`COUNT(*)`.mapWith(Number) }).from(r())
      .where(and(inArray(r().runId, g.runs.map(x => x.id)), eq(r().verdict, 'fail'), sql`${expr} IS NOT NULL`))
      .groupBy(r().runId)
    const byRun = new Map(rows.map(x => [x.runId, x.n]))
    for (const run of g.runs) out.set(run.id, withAccepted(run.counts, byRun.get(run.id) ?? 0))
  }
  return out
}

/** A run as read, with accepted failures counted as `accepted` (overall and per region) and the deviations that did it. */
export async function runWithDeviations(detail: Omit<RunDetail, 'storedCounts' | 'deviations'>): Promise<RunDetail> {
  const ref = { id: detail.id, versionId: detail.version.id, setId: detail.set.id, setSlug: detail.set.slug }
  const { applied, columns } = await runDeviationColumns(ref)
  const base: RunDetail = { ...detail, storedCounts: detail.summary.counts, deviations: [] }
  if (!applied.length || !(await hasAccepted(detail.id, columns))) {
    base.deviations = applied.map(d => appliedDeviation(d, 0))
    return base
  }
  const rows = await useDb().select({ region: r().region, by: columns.acceptedBy, n: sql<number>`COUNT(*)`.mapWith(Number) }).from(r())
    .where(and(eq(r().runId, detail.id), eq(r().verdict, 'fail'))).groupBy(r().region, columns.acceptedBy)
  const perRegion = new Map<string, number>()
  const perDeviation = new Map<number, number>()
  let total = 0
  for (const row of rows) {
    if (row.by === null) continue
    total += row.n
    perRegion.set(row.region ?? '', (perRegion.get(row.region ?? '') ?? 0) + row.n)
    perDeviation.set(row.by, (perDeviation.get(row.by) ?? 0) + row.n)
  }
  const summary = { ...detail.summary, counts: withAccepted(detail.summary.counts, total) }
  const regions = Object.fromEntries(Object.entries(detail.regions).map(([k, f]) => [k, { ...f, counts: withAccepted(f.counts, perRegion.get(k) ?? 0) }]))
  const state = detail.state === 'stale' ? 'stale' : cellState({ revision: detail.set.revision, counts: summary.counts }, detail.set.revision)
  let worst = detail.worst
  if (worst) {
    const [w] = await useDb().select({ by: columns.acceptedBy }).from(r()).where(eq(r().id, worst.id))
    if (w?.by) worst = { ...worst, verdict: 'accepted', acceptedBy: w.by }
  }
  return { ...base, summary, regions, state, worst, deviations: applied.map(d => appliedDeviation(d, perDeviation.get(d.id) ?? 0)) }
}

async function hasAccepted(runId: number, columns: DeviationColumns): Promise<boolean> {
  const [row] = await useDb().select({ id: r().id }).from(r()).where(and(eq(r().runId, runId), eq(r().verdict, 'fail'), sql`${columns.acceptedBy} IS NOT NULL`)).limit(1)
  return Boolean(row)
}

function appliedDeviation(d: Deviation, accepted: number): AppliedDeviation {
  return {
    id: d.id, scope: d.scope, caseInputKey: d.caseInputKey, region: d.region, reason: d.reason,
    expiresAtVersion: d.expiresAtVersion, expiresOn: d.expiresOn ? new Date(d.expiresOn).toISOString() : null, accepted,
  }
}

/** A run's version and set, as the deviation rules need them (404 when there is no such run). */
export async function deviationRunRef(runId: number): Promise<DeviationRunRef> {
  const { runs, referenceSets } = schema
  const [row] = await useDb().select({ id: runs.id, versionId: runs.versionId, setId: runs.setId, setSlug: referenceSets.slug })
    .from(runs).innerJoin(referenceSets, eq(referenceSets.id, runs.setId)).where(eq(runs.id, runId))
  if (!row) throw httpError(404, 'not_found', `There is no run with id ${runId}.`)
  return row
}
