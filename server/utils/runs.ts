// Reading runs back: the run with its code, version and set, and its case
// results joined with the reference values they were judged against.
import { and, asc, desc, eq, gte, inArray, lte, sql, type SQL } from 'drizzle-orm'
import { cellState } from '../../shared/domain/board'
import type { RunCaseRow, RunDetail, RunFigures } from '../../shared/domain/api-types'
import { VERDICTS, type Verdict } from '../../shared/domain/enums'
import { plainDeviationColumns, runWithDeviations, type DeviationColumns } from './deviations'

const r = () => schema.caseResults
const c = () => schema.cases

/** A result's inputs: its case's, or its own for a row that matched no case. */
export const caseInputs = () => sql<Record<string, string> | null>`COALESCE(${r().inputs}, ${c().inputs})`
  .mapWith((v: unknown) => (typeof v === 'string' ? JSON.parse(v) as Record<string, string> : v as Record<string, string> | null))

/** The columns of a case row; `dev` (server/utils/deviations.ts) shows the verdict with approved deviations applied. */
export const caseRowColumns = (dev: DeviationColumns = plainDeviationColumns()) => ({
  id: r().id, line: r().lineNumber, inputs: caseInputs(), region: r().region, measured: r().measured,
  reference: c().referenceValue, referenceDigits: c().certifiedDigits, kappa: c().conditionNumber,
  absError: r().absError, relError: r().relError, ulps: r().ulps, digitsAgreed: r().digitsAgreed,
  verdict: dev.verdict, decidedBy: r().decidedBy, storedVerdict: r().verdict, acceptedBy: dev.acceptedBy,
})

const blankCounts = () => Object.fromEntries(VERDICTS.map(v => [v, 0])) as Record<Verdict, number>

export async function loadRun(id: number): Promise<RunDetail> {
  const db = useDb()
  const { runs, versions, codes, referenceSets: sets, users } = schema
  const [row] = await db.select({ run: runs, version: versions, code: codes, set: sets, by: users.email })
    .from(runs)
    .innerJoin(versions, eq(versions.id, runs.versionId))
    .innerJoin(codes, eq(codes.id, versions.codeId))
    .innerJoin(sets, eq(sets.id, runs.setId))
    .leftJoin(users, eq(users.id, runs.submittedBy))
    .where(eq(runs.id, id))
  if (!row) throw httpError(404, 'not_found', `There is no run with id ${id}.`)
  const latest = await latestRevision(row.set.slug)
  const stored = row.run.regions as { overall: RunFigures, regions: Record<string, RunFigures> }
  const worst = row.run.worstCaseId
    ? (await db.select(caseRowColumns()).from(r()).leftJoin(c(), eq(c().id, r().caseId)).where(eq(r().id, row.run.worstCaseId)))[0] ?? null
    : null
  const figures = (f: RunFigures): RunFigures => ({ total: f.total, counts: { ...blankCounts(), ...f.counts }, maxRelError: f.maxRelError, medianRelError: f.medianRelError, rmsRelError: f.rmsRelError, maxUlps: f.maxUlps })
  return runWithDeviations({
    id: row.run.id,
    createdAt: new Date(row.run.createdAt).toISOString(),
    code: { slug: row.code.slug, name: row.code.name },
    version: { id: row.version.id, label: row.version.label, commitId: row.version.commitId },
    set: { id: row.set.id, slug: row.set.slug, name: row.set.name, revision: row.set.revision, functionId: row.set.functionId, targetDigits: row.set.targetDigits, parameters: parameterNames(row.set.functionId), criterion: row.set.criterion },
    fileName: row.run.fileName,
    fileSha256: row.run.fileSha256,
    fileSize: row.run.fileSize,
    submittedBy: row.by ?? (row.run.tokenId ? 'CI token' : null),
    state: cellState({ revision: row.set.revision, counts: row.run.counts }, latest?.revision ?? row.set.revision),
    summary: figures(stored.overall),
    regions: Object.fromEntries(Object.entries(stored.regions).map(([k, f]) => [k, figures(f)])),
    worst: worst as RunCaseRow | null,
    isRegression: row.run.isRegression,
  })
}

export interface CaseFilter {
  verdict?: Verdict[]
  region?: string
  minRel?: number
  maxRel?: number
  caseId?: number
}

export function caseWhere(runId: number, f: CaseFilter, dev: DeviationColumns = plainDeviationColumns()): SQL {
  const parts: SQL[] = [eq(r().runId, runId)]
  if (f.verdict?.length) parts.push(inArray(dev.verdict, f.verdict))
  if (f.region) parts.push(eq(r().region, f.region))
  if (f.minRel !== undefined) parts.push(gte(r().relErrorKey, f.minRel))
  if (f.maxRel !== undefined) parts.push(lte(r().relErrorKey, f.maxRel))
  if (f.caseId !== undefined) parts.push(eq(r().id, f.caseId))
  return and(...parts)!
}

export const SORTS = {
  line: () => r().lineNumber,
  relError: () => r().relErrorKey,
  absError: () => r().absErrorKey,
  ulps: () => r().ulpsKey,
  digitsAgreed: () => sql`CAST(${r().digitsAgreed} AS DECIMAL(10,4))`,
  verdict: () => r().verdict,
} as const

export function orderFor(sort: keyof typeof SORTS, dir: 'asc' | 'desc', dev: DeviationColumns = plainDeviationColumns()) {
  const col = sort === 'verdict' ? dev.verdict : SORTS[sort]()
  // nulls (no error figure) sort last either way; the id keeps pages stable
  return [sql`${col} IS NULL`, dir === 'asc' ? asc(col) : desc(col), asc(r().id)]
}
