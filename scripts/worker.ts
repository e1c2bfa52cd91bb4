// The job worker: claims queued jobs from MariaDB and runs them, off the web
// server's request thread, and delivers the mail outbox over SMTP beside them
// (retrying with doubling waits). Run one or more: `npx tsx scripts/worker.ts`.
// --once: run the jobs until the queue is empty, then exit (used by the seed; no mail).
import { hostname } from 'node:os'
import { createDb, createPool, databaseUrl } from '../server/database/client'
import { claimNext, fail } from '../server/jobs/queue'
import { computeReferenceSet, markSetFailed } from '../server/jobs/reference-set-job'
import { deliverDue } from '../server/mail/outbox'
import { smtpSender } from '../server/mail/transport'

const once = process.argv.includes('--once')
const pool = createPool(databaseUrl())
const db = createDb(pool)
const me = `${hostname()}:${process.pid}`
let stopping = false
process.on('SIGTERM', () => { stopping = true })
process.on('SIGINT', () => { stopping = true })

async function runOne(): Promise<boolean> {
  const job = await claimNext(db, me)
  if (!job) return false
  const payload = job.payload as { setId?: number }
  try {
    if (job.kind === 'reference-set' && payload.setId) await computeReferenceSet(db, job.id, payload.setId)
    else throw new Error(`unknown job kind '${job.kind}'`)
  }
  catch (e) {
    const message = e instanceof Error ? e.message : String(e)
    console.error(`job ${job.id} (${job.kind}) failed: ${message}`)
    await fail(db, job.id, message)
    if (payload.setId) await markSetFailed(db, payload.setId, message)
  }
  return true
}

const pause = (ms: number) => new Promise(resolve => setTimeout(resolve, ms))

// Mail goes out on its own loop, so a long reference computation never holds it up for long.
async function deliverMail() {
  const send = smtpSender()
  while (!stopping) {
    try {
      const { sent, failed } = await deliverDue(db, send)
      if (failed) console.error(`mail: ${failed} message(s) could not be sent; they will be retried`)
      if (sent + failed === 0) await pause(500)
    }
    catch (e) {
      console.error(`mail delivery: ${e instanceof Error ? e.message : String(e)}`)
      await pause(2000)
    }
  }
}
const mail = once ? Promise.resolve() : deliverMail()

try {
  while (!stopping) {
    const worked = await runOne()
    if (!worked) {
      if (once) break
      await new Promise(resolve => setTimeout(resolve, 500))
    }
  }
}
finally {
  stopping = true
  await mail
  await pool.end()
}
