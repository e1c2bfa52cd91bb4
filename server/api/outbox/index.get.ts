import { desc, count, eq } from 'drizzle-orm'
import { z } from 'zod'
import { mailStates } from '../../database/schema'

const query = z.object({
  state: z.enum(mailStates, { error: 'Choose queued, sent or failed.' }).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
})

// The mail outbox for administrators: what is queued, sent or failed, with attempts and the last error.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const q = validQuery(event, query)
  const m = schema.mailOutbox
  const db = useDb()
  const rows = await db.select({
    id: m.id, kind: m.kind, to: m.toAddress, subject: m.subject, state: m.state, attempts: m.attempts,
    lastError: m.lastError, nextAttemptAt: m.nextAttemptAt, sentAt: m.sentAt, createdAt: m.createdAt,
  }).from(m).where(q.state ? eq(m.state, q.state) : undefined).orderBy(desc(m.id)).limit(q.limit)
  const totals = await db.select({ state: m.state, n: count() }).from(m).groupBy(m.state)
  const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null)
  return {
    totals: Object.fromEntries(mailStates.map(s => [s, totals.find(t => t.state === s)?.n ?? 0])),
    messages: rows.map(r => ({ ...r, nextAttemptAt: iso(r.nextAttemptAt), sentAt: iso(r.sentAt), createdAt: iso(r.createdAt) })),
  }
})
