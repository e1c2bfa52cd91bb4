// A code's history across versions: the latest run of each version on each
// reference-set slug (the trend), and for each failure of the newest verified
// version, the first version in which it appeared.
import { and, count, desc, eq, inArray } from 'drizzle-orm'
import { FAILING, cellState, failures } from '../../shared/domain/board'
import type { CodeTrendSeries, CurrentFailures } from '../../shared/domain/api-types'
import type { Verdict } from '../../shared/domain/enums'
import { latestRuns } from './board'
import { caseInputs } from './runs'

const FAILURES_SHOWN = 200

interface VersionRow { id: number, label: string }

export async function codeTrend(versions: VersionRow[]): Promise<CodeTrendSeries[]> {
  const db = useDb()
  const latest = await latestRuns(versions.map(v => v.id))
  if (!latest.length) return []
  const slugs = [...new Set(latest.map(r => r.slug))].sort()
  const sets = await db.select({ slug: schema.referenceSets.slug, name: schema.referenceSets.name, revision: schema.referenceSets.revision })
    .from(schema.referenceSets).where(inArray(schema.referenceSets.slug, slugs)).orderBy(desc(schema.referenceSets.revision))
  const runs = await db.select({ id: schema.runs.id, maxRelError: schema.runs.maxRelError, medianRelError: schema.runs.medianRelError, maxUlps: schema.runs.maxUlps })
    .from(schema.runs).where(inArray(schema.runs.id, latest.map(r => r.id)))
  const figures = new Map(runs.map(r => [r.id, r]))
  return slugs.map((slug) => {
    const current = sets.find(s => s.slug === slug)!
    const points = versions.flatMap((v) => {
      const run = latest.find(r => r.versionId === v.id && r.slug === slug)
      if (!run) return []
      const f = figures.get(run.id)!
      return [{
        versionId: v.id, label: v.label, runId: run.id, revision: run.revision,
        state: cellState({ revision: run.revision, counts: run.counts }, current.revision),
        failures: failures(run.counts), regression: run.isRegression,
        maxRelError: f.maxRelError, medianRelError: f.medianRelError, maxUlps: f.maxUlps,
      }]
    })
    return { slug, name: current.name, revision: current.revision, points }
  })
}

/**
 * Failures of one version (by default the newest that has runs), each with the first version
 * it appeared in: walk back through earlier versions' runs on the same slug
 * while the case (matched by its exact inputs) still fails. A version without
 * a run on the set is passed over; a run whose set lacks the case ends the walk.
 */
export async function currentFailures(versions: VersionRow[], trend: CodeTrendSeries[], atLabel?: string): Promise<CurrentFailures | null> {
  const newest = atLabel
    ? versions.find(v => v.label === atLabel)
    : [...versions].reverse().find(v => trend.some(s => s.points.some(p => p.versionId === v.id)))
  if (!newest) return null
  const db = useDb()
  const r = schema.caseResults
  const c = schema.cases
  const sets = []
  for (const series of trend) {
    const at = series.points.findIndex(p => p.versionId === newest.id)
    if (at < 0) continue
    const point = series.points[at]!
    if (point.failures === 0) continue
    const failingWhere = and(eq(r.runId, point.runId), inArray(r.verdict, FAILING))
    const [total] = await db.select({ n: count() }).from(r).where(failingWhere)
    const rows = await db.select({ id: r.id, key: c.inputKey, inputs: caseInputs(), verdict: r.verdict, relError: r.relError, ulps: r.ulps })
      .from(r).leftJoin(c, eq(c.id, r.caseId)).where(failingWhere)
      .orderBy(desc(r.relErrorKey), r.id).limit(FAILURES_SHOWN)
    const earlier = series.points.slice(0, at).reverse()
    const keys = rows.map(x => x.key).filter((k): k is string => k !== null)
    const verdicts = new Map<string, Verdict>()
    if (keys.length && earlier.length) {
      const seen = await db.select({ runId: r.runId, key: c.inputKey, verdict: r.verdict }).from(r).innerJoin(c, eq(c.id, r.caseId))
        .where(and(inArray(r.runId, earlier.map(p => p.runId)), inArray(c.inputKey, keys)))
      for (const s of seen) verdicts.set(`${s.runId}:${s.key}`, s.verdict)
    }
    sets.push({
      slug: series.slug, name: series.name, runId: point.runId, total: Number(total?.n ?? 0),
      cases: rows.map((row) => {
        let first = point
        if (row.key) {
          for (const p of earlier) {
            const v = verdicts.get(`${p.runId}:${row.key}`)
            if (!v || !FAILING.includes(v)) break
            first = p
          }
        }
        return { resultId: row.id, inputs: row.inputs, verdict: row.verdict, relError: row.relError, ulps: row.ulps, firstVersion: first.label, firstRunId: first.runId }
      }),
    })
  }
  return { version: newest.label, versionId: newest.id, sets }
}
