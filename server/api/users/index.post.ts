import { eq } from 'drizzle-orm'
import { createUserSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const input = await validBody(event, createUserSchema)
  const db = useDb()
  const [existing] = await db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email))
  if (existing) {
    throw httpError(409, 'conflict', `Invalid body: email: ${input.email} already has an account.`, { issues: [{ field: 'email', message: 'This address already has an account.' }] })
  }
  const passwordHash = await hashPassword(input.password)
  const id = await db.transaction(async (tx) => {
    const [res] = await tx.insert(schema.users).values({ email: input.email, name: input.name, role: input.role, passwordHash }).$returningId()
    await recordAudit(tx, admin, 'create-user', 'user', res!.id, { email: input.email, role: input.role })
    return res!.id
  })
  setResponseStatus(event, 201)
  return { user: { id, email: input.email, name: input.name, role: input.role, disabled: false } }
})
