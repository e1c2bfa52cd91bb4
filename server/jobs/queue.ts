// A job queue in MariaDB. Workers claim the oldest queued job with
// SELECT … FOR UPDATE SKIP LOCKED, so any number of worker processes on any
// number of machines share the work without a home-made cluster. A job whose
// worker died (claimed long ago, still running) is queued again.
import { and, eq, lt, sql } from 'drizzle-orm'
import type { Db } from '../database/client'
import { jobs, type Job } from '../database/schema'

type Writer = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export async function enqueue(db: Writer, kind: string, payload: unknown, total = 0) {
  const [row] = await db.insert(jobs).values({ kind, payload, total }).$returningId()
  return row!.id
}

export async function claimNext(db: Db, worker: string, staleMinutes = 10): Promise<Job | null> {
  await db.update(jobs).set({ state: 'queued', claimedBy: null, claimedAt: null })
    .where(and(eq(jobs.state, 'running'), lt(jobs.claimedAt, sql`NOW(3) - INTERVAL ${staleMinutes} MINUTE`)))
  return db.transaction(async (tx) => {
    const [rows] = await tx.execute(sql`SELECT id FROM ${jobs} WHERE ${jobs.state} = 'queued' ORDER BY ${jobs.id} LIMIT 1 FOR UPDATE SKIP LOCKED`) as unknown as [Array<{ id: number }>]
    const id = rows[0]?.id
    if (!id) return null
    await tx.update(jobs).set({ state: 'running', claimedBy: worker, claimedAt: new Date() }).where(eq(jobs.id, id))
    const [job] = await tx.select().from(jobs).where(eq(jobs.id, id))
    return job ?? null
  })
}

export async function reportProgress(db: Db, id: number, progress: number, total: number) {
  await db.update(jobs).set({ progress, total }).where(eq(jobs.id, id))
}

export async function finish(db: Writer, id: number) {
  await db.update(jobs).set({ state: 'done' }).where(eq(jobs.id, id))
}

export async function fail(db: Db, id: number, error: string) {
  await db.update(jobs).set({ state: 'failed', error }).where(eq(jobs.id, id))
}
