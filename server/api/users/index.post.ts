import { eq } from 'drizzle-orm'
import { createUserSchema } from '../../../shared/schemas/auth'
import { queueInvitation } from '../../mail/notifications'

// Add a user. Without a password (the usual way) they get an invitation by
// e-mail with a single-use link to choose one; user, link and mail are stored together.
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const input = await validBody(event, createUserSchema)
  const db = useDb()
  const [existing] = await db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email))
  if (existing) {
    throw httpError(409, 'conflict', `Invalid body: email: ${input.email} already has an account.`, { issues: [{ field: 'email', message: 'This address already has an account.' }] })
  }
  const passwordHash = input.password ? await hashPassword(input.password) : null
  const id = await db.transaction(async (tx) => {
    const [res] = await tx.insert(schema.users).values({ email: input.email, name: input.name, role: input.role, passwordHash }).$returningId()
    const id = res!.id
    await recordAudit(tx, admin, 'create-user', 'user', id, { email: input.email, role: input.role, invited: !passwordHash })
    if (!passwordHash) await queueInvitation(tx, { id, email: input.email, name: input.name, role: input.role }, admin)
    return id
  })
  setResponseStatus(event, 201)
  return { user: { id, email: input.email, name: input.name, role: input.role, disabled: false }, invited: !passwordHash }
})
