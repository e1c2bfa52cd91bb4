// Storing a judged run: one transaction for the version (when new), the run,
// its raw file, every case result, the set's freeze and the audit entry.
// Either all of it is stored or none of it.
import { and, eq, isNull, sql } from 'drizzle-orm'
import mysql from 'mysql2'
import type { BuildEnvironment, ReferenceSet } from '../database/schema'
import type { JudgedRun } from './submissions'
import type { CurrentUser } from './auth'

const BATCH = 5000

const RESULT_COLUMNS = ['run_id', 'case_id', 'line_number', 'inputs', 'measured', 'abs_error', 'rel_error', 'ulps', 'digits_agreed',
  'region', 'rel_error_key', 'abs_error_key', 'ulps_key', 'verdict', 'decided_by'] as const

type ResultRow = JudgedRun['results'][number]

/** One multi-row INSERT as text: values escaped by mysql2 (JSON as strings), far faster than bound parameters for large runs. */
function resultsInsert(runId: number, rows: ResultRow[]): string {
  const num = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : v)
  const values = rows.map(r => [runId, r.caseId ?? null, r.lineNumber ?? null, r.inputs ? JSON.stringify(r.inputs) : null, r.measured ?? null,
    r.absError ?? null, r.relError ?? null, r.ulps ?? null, r.digitsAgreed ?? null, r.region ?? null,
    num(r.relErrorKey), num(r.absErrorKey), num(r.ulpsKey), r.verdict, r.decidedBy])
  return mysql.format(`INSERT INTO case_results (${RESULT_COLUMNS.join(', ')}) VALUES ?`, [values])
}

export interface StoreInput {
  set: ReferenceSet
  codeId: number
  versionLabel: string
  versionId: number | null
  commit?: string
  environment?: BuildEnvironment
  fileName: string
  data: Buffer
  sha: string
  mapping: Record<string, string>
  judged: JudgedRun
  actor: CurrentUser | { id: null, email: string }
  tokenId: number | null
}

export async function storeRun(input: StoreInput): Promise<number> {
  const db = useDb()
  const { summary, results } = input.judged
  const clock = stepClock()
  return db.transaction(async (tx) => {
    let versionId = input.versionId
    if (!versionId) {
      const [v] = await tx.insert(schema.versions).values({ codeId: input.codeId, label: input.versionLabel, commitId: input.commit ?? '', environment: input.environment ?? {} }).$returningId()
      versionId = v!.id
      await recordAudit(tx, input.actor, 'create-version', 'version', versionId, { label: input.versionLabel })
    }
    const { regions, ...overall } = summary
    const [run] = await tx.insert(schema.runs).values({
      versionId, setId: input.set.id,
      submittedBy: input.actor.id, tokenId: input.tokenId,
      fileName: input.fileName.slice(0, 255), fileSha256: input.sha, fileSize: input.data.length,
      columnMapping: input.mapping, counts: overall.counts,
      maxRelError: overall.maxRelError, medianRelError: overall.medianRelError, rmsRelError: overall.rmsRelError, maxUlps: overall.maxUlps,
      regions: { overall: { ...overall, worst: null }, regions: Object.fromEntries(Object.entries(regions).map(([k, f]) => [k, { ...f, worst: null }])) },
    }).$returningId()
    const runId = run!.id
    await tx.insert(schema.runFiles).values({ runId, content: input.data })
    clock('store: run row and file')
    let formatMs = 0
    for (let i = 0; i < results.length; i += BATCH) {
      const t = performance.now()
      const statement = resultsInsert(runId, results.slice(i, i + BATCH))
      formatMs += performance.now() - t
      await tx.execute(sql.raw(statement))
    }
    clock(`store: case results (${formatMs.toFixed(0)} ms of it building the statements)`)
    const worst = overall.worst ? results[overall.worst.index] : undefined
    if (worst) {
      const [w] = await tx.select({ id: schema.caseResults.id }).from(schema.caseResults).where(and(
        eq(schema.caseResults.runId, runId),
        worst.caseId ? eq(schema.caseResults.caseId, worst.caseId) : isNull(schema.caseResults.caseId),
        worst.lineNumber ? eq(schema.caseResults.lineNumber, worst.lineNumber) : isNull(schema.caseResults.lineNumber),
      )).limit(1)
      if (w) await tx.update(schema.runs).set({ worstCaseId: w.id }).where(eq(schema.runs.id, runId))
    }
    await tx.update(schema.referenceSets).set({ frozenAt: new Date() }).where(and(eq(schema.referenceSets.id, input.set.id), isNull(schema.referenceSets.frozenAt)))
    clock('store: worst case and freeze')
    await supersedeSignOffs(tx, versionId, runId, input.actor)
    await recordAudit(tx, input.actor, 'submit-run', 'run', runId, { versionId, setId: input.set.id, sha256: input.sha, counts: overall.counts })
    return runId
  })
}
