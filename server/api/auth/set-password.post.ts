import { and, eq, isNull } from 'drizzle-orm'
import { setPasswordSchema } from '../../../shared/schemas/auth'

// Public route: choose a password with a single-use link. The link, and every
// other open link of the same person, is spent in the same transaction.
export default defineEventHandler(async (event) => {
  const { token, password } = await validBody(event, setPasswordSchema)
  const hash = await hashPassword(password)
  const db = useDb()
  const user = await db.transaction(async (tx) => {
    const { link, user } = await liveLink(tx, token, true)
    await tx.update(schema.users).set({ passwordHash: hash, passwordChangedAt: new Date() }).where(eq(schema.users.id, user.id))
    await tx.update(schema.userTokens).set({ usedAt: new Date() }).where(and(eq(schema.userTokens.userId, user.id), isNull(schema.userTokens.usedAt)))
    await recordAudit(tx, { id: user.id, email: user.email, name: user.name, role: user.role }, link.purpose === 'invite' ? 'accept-invitation' : 'reset-password', 'user', user.id)
    return user
  })
  return { ok: true, email: user.email }
})
