// The mail outbox: every message is a row in mail_outbox first, written in the
// caller's transaction, so mail is never lost with a crash and never blocks
// the work that caused it. Workers deliver due rows, claimed with
// SELECT … FOR UPDATE SKIP LOCKED and leased while they send; a failure is
// retried with doubling waits, and after the last attempt the row is marked
// failed with its error for an administrator to read on the Outbox page.
import { eq, inArray, sql } from 'drizzle-orm'
import type { Db } from '../database/client'
import { mailOutbox, type MailMessage } from '../database/schema'
import { mailSettings, retryDelayMs, type MailSettings } from './config'

export type Writer = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export interface OutgoingMail {
  kind: string
  to: string
  subject: string
  text: string
  html: string
}

export async function queueMail(db: Writer, m: OutgoingMail): Promise<number> {
  const [row] = await db.insert(mailOutbox).values({ kind: m.kind, toAddress: m.to, subject: m.subject.slice(0, 255), textBody: m.text, htmlBody: m.html }).$returningId()
  return row!.id
}

const LEASE_SECONDS = 120

/** Claim up to `limit` due messages; each claim counts as an attempt and hides the row from other workers for the lease. */
export async function claimDue(db: Db, limit = 20): Promise<MailMessage[]> {
  return db.transaction(async (tx) => {
    const [rows] = await tx.execute(sql`SELECT id FROM ${mailOutbox} WHERE ${mailOutbox.state} = 'queued' AND ${mailOutbox.nextAttemptAt} <= NOW(3) ORDER BY ${mailOutbox.id} LIMIT ${limit} FOR UPDATE SKIP LOCKED`) as unknown as [Array<{ id: number }>]
    const ids = rows.map(r => r.id)
    if (!ids.length) return []
    await tx.update(mailOutbox).set({ attempts: sql`${mailOutbox.attempts} + 1`, nextAttemptAt: sql`NOW(3) + INTERVAL ${LEASE_SECONDS} SECOND` }).where(inArray(mailOutbox.id, ids))
    return tx.select().from(mailOutbox).where(inArray(mailOutbox.id, ids))
  })
}

export type Send = (m: MailMessage) => Promise<void>

/** Deliver what is due; returns how many were sent and how many failed this round. */
export async function deliverDue(db: Db, send: Send, settings: MailSettings = mailSettings()): Promise<{ sent: number, failed: number }> {
  const due = await claimDue(db)
  let sent = 0
  let failed = 0
  for (const m of due) {
    try {
      await send(m)
      await db.update(mailOutbox).set({ state: 'sent', sentAt: sql`NOW(3)`, lastError: null }).where(eq(mailOutbox.id, m.id))
      sent++
    }
    catch (e) {
      failed++
      const error = (e instanceof Error ? e.message : String(e)).slice(0, 2000)
      const last = m.attempts >= settings.maxAttempts
      const waitMs = retryDelayMs(m.attempts, settings)
      await db.update(mailOutbox).set({
        state: last ? 'failed' : 'queued',
        lastError: last ? `gave up after ${m.attempts} attempts: ${error}` : error,
        nextAttemptAt: sql`NOW(3) + INTERVAL ${waitMs * 1000} MICROSECOND`,
      }).where(eq(mailOutbox.id, m.id))
    }
  }
  return { sent, failed }
}
