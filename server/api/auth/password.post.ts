import { eq } from 'drizzle-orm'
import { changePasswordSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ...ANY_ROLE)
  const { currentPassword, newPassword } = await validBody(event, changePasswordSchema)
  const db = useDb()
  const [row] = await db.select({ hash: schema.users.passwordHash }).from(schema.users).where(eq(schema.users.id, user.id))
  if (!row?.hash || !(await verifyPassword(row.hash, currentPassword))) {
    throw httpError(400, 'invalid_input', 'Invalid body: currentPassword: The current password is wrong.', { issues: [{ field: 'currentPassword', message: 'The current password is wrong.' }] })
  }
  const hash = await hashPassword(newPassword)
  await db.transaction(async (tx) => {
    await tx.update(schema.users).set({ passwordHash: hash, passwordChangedAt: new Date() }).where(eq(schema.users.id, user.id))
    await recordAudit(tx, user, 'change-password', 'user', user.id)
  })
  // every other session of this account now ends (server/utils/auth.ts); this one goes on
  await setUserSession(event, { loggedInAt: Date.now() })
  return { ok: true }
})
