// The regression flag, set when a run is stored (inside its transaction):
// the rule is in shared/domain/regression.ts.
import { and, count, desc, eq, inArray } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { FAILING, failures } from '../../shared/domain/board'
import { isWorse, type RegressionEvidence } from '../../shared/domain/regression'
import { sortVersions } from '../../shared/domain/versions'
import type { Tx } from './audit'

type Reader = Tx | ReturnType<typeof useDb>

/** The latest run of the nearest earlier version on a set with this slug, or null. */
export async function previousRun(db: Reader, codeId: number, versionId: number, setSlug: string) {
  const { versions, runs, referenceSets: sets } = schema
  const list = sortVersions(await db.select({ id: versions.id, label: versions.label, createdAt: versions.createdAt }).from(versions).where(eq(versions.codeId, codeId)))
  const at = list.findIndex(v => v.id === versionId)
  const earlier = list.slice(0, Math.max(at, 0)).map(v => v.id)
  if (!earlier.length) return null
  const candidates = await db.select({ id: runs.id, versionId: runs.versionId, setId: runs.setId, counts: runs.counts })
    .from(runs).innerJoin(sets, eq(sets.id, runs.setId))
    .where(and(eq(sets.slug, setSlug), inArray(runs.versionId, earlier)))
    .orderBy(desc(runs.id))
  for (const id of earlier.reverse()) {
    const run = candidates.find(r => r.versionId === id)
    if (run) return run
  }
  return null
}

/** Compare a stored run with its predecessor; null when there is none. */
export async function regressionEvidence(db: Reader, run: { id: number, codeId: number, versionId: number, setSlug: string, counts: Parameters<typeof failures>[0] }): Promise<RegressionEvidence | null> {
  const prev = await previousRun(db, run.codeId, run.versionId, run.setSlug)
  if (!prev) return null
  const nr = alias(schema.caseResults, 'nr')
  const nc = alias(schema.cases, 'nc')
  const pr = alias(schema.caseResults, 'pr')
  const pc = alias(schema.cases, 'pc')
  const [row] = await db.select({ n: count() })
    .from(nr)
    .innerJoin(nc, eq(nc.id, nr.caseId))
    .innerJoin(pc, and(eq(pc.setId, prev.setId), eq(pc.inputKey, nc.inputKey)))
    .innerJoin(pr, and(eq(pr.caseId, pc.id), eq(pr.runId, prev.id)))
    .where(and(eq(nr.runId, run.id), inArray(nr.verdict, FAILING), inArray(pr.verdict, ['pass', 'accepted'])))
  return { previousRunId: prev.id, newlyFailing: Number(row?.n ?? 0), failuresBefore: failures(prev.counts), failuresAfter: failures(run.counts) }
}

/** Set runs.is_regression for a run just stored, in the caller's transaction. */
export async function markRegression(tx: Reader, run: Parameters<typeof regressionEvidence>[1]): Promise<RegressionEvidence | null> {
  const evidence = await regressionEvidence(tx, run)
  if (evidence && isWorse(evidence)) await tx.update(schema.runs).set({ isRegression: true }).where(eq(schema.runs.id, run.id))
  return evidence
}
