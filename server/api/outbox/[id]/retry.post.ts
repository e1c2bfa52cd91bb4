import { eq, sql } from 'drizzle-orm'
import { idParamSchema } from '../../../../shared/schemas/auth'

// Send again a message the worker gave up on (state failed): it goes back in
// the queue with its attempts counted afresh, and the worker picks it up on its
// next round. Queued and sent messages are left as they are (409).
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const { id } = validParams(event, idParamSchema)
  const m = schema.mailOutbox
  // the message's state before: only a failed one is queued again
  const before = await useDb().transaction(async (tx) => {
    const [row] = await tx.select({ state: m.state, attempts: m.attempts, to: m.toAddress, kind: m.kind, lastError: m.lastError }).from(m).where(eq(m.id, id)).for('update')
    if (row?.state !== 'failed') return row?.state ?? null
    await tx.update(m).set({
      state: 'queued', attempts: 0, nextAttemptAt: sql`NOW(3)`,
      lastError: `sent again by ${admin.email} after ${row.attempts} attempts; before that: ${row.lastError ?? 'no error kept'}`.slice(0, 2000),
    }).where(eq(m.id, id))
    await recordAudit(tx, admin, 'requeue-mail', 'mail', id, { to: row.to, kind: row.kind, attempts: row.attempts })
    return row.state
  })
  if (!before) throw httpError(404, 'not_found', `There is no message with id ${id} in the outbox.`)
  if (before !== 'failed') throw httpError(409, 'not_failed', `Message ${id} is ${before}; only a message the worker gave up on can be sent again.`)
  return { id, state: 'queued' as const }
})
