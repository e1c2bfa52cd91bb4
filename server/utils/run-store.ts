// Storing a judged run: one transaction for the version (when new), the run,
// its raw file, every case result, the set's freeze and the audit entry.
// Either all of it is stored or none of it.
//
// Case results go in with LOAD DATA LOCAL INFILE, a chunk at a time, each
// chunk sent while the next one is judged: MariaDB inserts on one core while
// Node judges on the other. LOCAL turns data errors into warnings, so every
// chunk must come back with as many rows and no warning, or the transaction
// is rolled back.
import { Readable } from 'node:stream'
import { and, eq, isNull } from 'drizzle-orm'
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2'
import type { PoolConnection, ResultSetHeader } from 'mysql2/promise'
import type { BuildEnvironment, ReferenceSet } from '../database/schema'
import type { JudgedRun } from './submissions'
import type { CurrentUser } from './auth'
import { LOAD_RESULTS, resultsTsv } from './load-data'
import { queueRunFailureNotice } from '../mail/notifications'
import type { Environment } from '../../shared/schemas/submission'
import { checkBuild } from './submissions'

/**
 * Start loading one chunk. `sent` settles once the whole chunk has been
 * handed to the socket (the server then inserts it on its own), `done` when
 * the server has answered.
 */
function loadChunk(conn: PoolConnection, tsv: Buffer, expected: number) {
  let markSent!: () => void
  const sent = new Promise<void>((resolve) => { markSent = resolve })
  const done = conn.query({
    sql: LOAD_RESULTS,
    infileStreamFactory: () => {
      const stream = Readable.from([tsv])
      stream.once('end', () => markSent())
      return stream
    },
  } as Parameters<PoolConnection['query']>[0]).then(([header]) => {
    const h = header as ResultSetHeader
    if (h.affectedRows !== expected || h.warningStatus !== 0) {
      throw new Error(`storing case results: ${h.affectedRows} of ${expected} rows went in, with ${h.warningStatus} warning(s)`)
    }
  })
  done.catch(() => markSent())
  return { sent, done }
}

export interface StoreInput {
  set: ReferenceSet
  codeId: number
  versionLabel: string
  versionId: number | null
  commit?: string
  environment?: BuildEnvironment
  /** The submission adds commit or environment fields that the existing version lacks. */
  fillsBuild?: boolean
  fileName: string
  data: Buffer
  sha: string
  mapping: Record<string, string>
  judged: JudgedRun
  actor: CurrentUser | { id: null, email: string }
  tokenId: number | null
}

/** True for MariaDB's duplicate-key error (1062), as mysql2 raises it or as Drizzle wraps it. */
function isDuplicateKey(e: unknown): boolean {
  const err = e as { code?: string, cause?: { code?: string } }
  return err?.code === 'ER_DUP_ENTRY' || err?.cause?.code === 'ER_DUP_ENTRY'
}

type Tx = MySql2Database<typeof schema>

/**
 * The run's version, in the run's transaction: made when new; otherwise
 * locked and checked against this submission's build (shared/domain/build.ts),
 * with the fields it lacks filled in. A version made a moment ago by a
 * submission running beside this one counts as existing: our insert waits for
 * that transaction, then meets the version's unique key.
 */
async function settleVersion(tx: Tx, input: StoreInput): Promise<number> {
  const v = schema.versions
  if (input.versionId === null) {
    try {
      const [made] = await tx.insert(v).values({ codeId: input.codeId, label: input.versionLabel, commitId: input.commit ?? '', environment: input.environment ?? {} }).$returningId()
      await recordAudit(tx, input.actor, 'create-version', 'version', made!.id, { label: input.versionLabel })
      return made!.id
    }
    catch (e) {
      if (!isDuplicateKey(e)) throw e
    }
  }
  else if (!input.fillsBuild) return input.versionId
  // fields are only ever added: lock the version and check against what it records now
  const [now] = await tx.select({ id: v.id, commitId: v.commitId, environment: v.environment }).from(v)
    .where(and(eq(v.codeId, input.codeId), eq(v.label, input.versionLabel))).for('update')
  const filled = checkBuild({ ...now!, label: input.versionLabel }, { commit: input.commit, environment: input.environment as Environment | undefined })
  if (filled) {
    await tx.update(v).set(filled).where(eq(v.id, now!.id))
    await recordAudit(tx, input.actor, 'complete-version-build', 'version', now!.id, { label: input.versionLabel, before: { commitId: now!.commitId, environment: now!.environment }, after: filled })
  }
  return now!.id
}

export async function storeRun(input: StoreInput): Promise<{ id: number, counts: Record<string, number>, duplicate: boolean }> {
  const conn = await usePool().getConnection()
  const tx = drizzle({ client: conn, schema, mode: 'default' })
  const clock = stepClock()
  await conn.beginTransaction()
  try {
    const versionId = await settleVersion(tx, input)
    // counts and figures are filled in once every case is judged, in this same transaction
    let runId: number
    try {
      const [run] = await tx.insert(schema.runs).values({
        versionId, setId: input.set.id,
        submittedBy: input.actor.id, tokenId: input.tokenId,
        fileName: input.fileName.slice(0, 255), fileSha256: input.sha, fileSize: input.data.length,
        columnMapping: input.mapping, counts: {}, regions: {},
      }).$returningId()
      runId = run!.id
    }
    catch (e) {
      if (!isDuplicateKey(e)) throw e
      // the same file for the same version and set, stored a moment ago by a submission running beside this one
      const r = schema.runs
      // (a locking read: it sees the other transaction's committed row whatever this one's snapshot)
      const [dup] = await tx.select({ id: r.id, counts: r.counts }).from(r).where(and(eq(r.versionId, versionId), eq(r.setId, input.set.id), eq(r.fileSha256, input.sha))).for('update')
      await conn.rollback()
      return { id: dup!.id, counts: dup!.counts as Record<string, number>, duplicate: true }
    }
    clock('store: run row')

    // the raw file goes in while the first chunk is judged; the chunks queue behind it
    let inFlight: Promise<void> = tx.insert(schema.runFiles).values({ runId, content: input.data }).then(() => {})
    inFlight.catch(() => {}) // awaited below; this only keeps an early failure from counting as unhandled
    let waitedMs = 0 // time Node spent waiting for MariaDB, for PLUMBLINE_TIMING
    let step = input.judged.chunks.next()
    for (; !step.done; step = input.judged.chunks.next()) {
      const tsv = resultsTsv(runId, step.value)
      const t = performance.now()
      await inFlight
      const chunk = loadChunk(conn, tsv, step.value.length)
      inFlight = chunk.done
      // once the chunk is on its way, judge the next one while the server inserts this one
      await chunk.sent
      waitedMs += performance.now() - t
    }
    const t = performance.now()
    await inFlight
    waitedMs += performance.now() - t
    clock(`store: judge and load case results (${waitedMs.toFixed(0)} ms of it waiting for MariaDB)`)

    const { summary, worst } = step.value
    const { regions, ...overall } = summary
    let worstCaseId: number | null = null
    if (worst) {
      const [w] = await tx.select({ id: schema.caseResults.id }).from(schema.caseResults).where(and(
        eq(schema.caseResults.runId, runId),
        worst.caseId ? eq(schema.caseResults.caseId, worst.caseId) : isNull(schema.caseResults.caseId),
        worst.lineNumber ? eq(schema.caseResults.lineNumber, worst.lineNumber) : isNull(schema.caseResults.lineNumber),
      )).limit(1)
      worstCaseId = w?.id ?? null
    }
    await tx.update(schema.runs).set({
      counts: overall.counts,
      maxRelError: overall.maxRelError, medianRelError: overall.medianRelError, rmsRelError: overall.rmsRelError, maxUlps: overall.maxUlps,
      regions: { overall: { ...overall, worst: null }, regions: Object.fromEntries(Object.entries(regions).map(([k, f]) => [k, { ...f, worst: null }])) },
      worstCaseId,
    }).where(eq(schema.runs.id, runId))
    await tx.update(schema.referenceSets).set({ frozenAt: new Date() }).where(and(eq(schema.referenceSets.id, input.set.id), isNull(schema.referenceSets.frozenAt)))
    clock('store: figures, worst case and freeze')
    await markRegression(tx, { id: runId, codeId: input.codeId, versionId, setSlug: input.set.slug, counts: overall.counts })
    await supersedeSignOffs(tx, versionId, runId, input.actor)
    await recordAudit(tx, input.actor, 'submit-run', 'run', runId, { versionId, setId: input.set.id, sha256: input.sha, counts: overall.counts })
    // the failure notice to the code's owners is stored with the run, in a
    // savepoint: a fault in composing it rolls back only the notice, never the run
    await conn.query('SAVEPOINT failure_notice')
    try {
      await queueRunFailureNotice(tx, runId)
      await conn.query('RELEASE SAVEPOINT failure_notice')
    }
    catch (e) {
      await conn.query('ROLLBACK TO SAVEPOINT failure_notice')
      console.error(`run ${runId}: the failure notice could not be queued: ${e instanceof Error ? e.message : String(e)}`)
    }
    await conn.commit()
    clock('store: commit')
    return { id: runId, counts: overall.counts, duplicate: false }
  }
  catch (e) {
    await conn.rollback().catch(() => {})
    throw e
  }
  finally {
    conn.release()
  }
}
