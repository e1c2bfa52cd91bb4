import { and, count, eq, gt, sql } from 'drizzle-orm'
import { forgotPasswordSchema } from '../../../shared/schemas/auth'
import { queuePasswordReset } from '../../mail/notifications'

const REPLY = { ok: true, message: 'If this address has an account, a message with a link to choose a new password is on its way. The link works once, within an hour.' }
const MAX_PER_HOUR = 3

// Public route: ask for a reset link. The reply is the same whether or not the
// address has an account, so it reveals nothing; at most three links an hour per account.
export default defineEventHandler(async (event) => {
  const { email } = await validBody(event, forgotPasswordSchema)
  const db = useDb()
  const [user] = await db.select({ id: schema.users.id, email: schema.users.email, name: schema.users.name, disabled: schema.users.disabled })
    .from(schema.users).where(eq(schema.users.email, email))
  if (user && !user.disabled) {
    const t = schema.userTokens
    await db.transaction(async (tx) => {
      const [recent] = await tx.select({ n: count() }).from(t)
        .where(and(eq(t.userId, user.id), eq(t.purpose, 'reset'), gt(t.createdAt, sql`NOW(3) - INTERVAL 1 HOUR`)))
      if ((recent?.n ?? 0) >= MAX_PER_HOUR) return
      await queuePasswordReset(tx, user)
      await recordAudit(tx, { id: null, email }, 'request-password-reset', 'user', user.id, { address: clientAddress(event) })
    })
  }
  setResponseStatus(event, 202)
  return REPLY
})
