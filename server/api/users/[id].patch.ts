import { eq } from 'drizzle-orm'
import { idParamSchema, updateUserSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const { id } = validParams(event, idParamSchema)
  const change = await validBody(event, updateUserSchema)
  if (id === admin.id && (change.disabled === true || (change.role && change.role !== 'admin'))) {
    throw httpError(400, 'invalid_input', 'You cannot disable yourself or remove your own admin role; ask another administrator.', { issues: [{ field: change.disabled ? 'disabled' : 'role', message: 'Not on your own account.' }] })
  }
  const db = useDb()
  const u = schema.users
  const updated = await db.transaction(async (tx) => {
    const [before] = await tx.select({ id: u.id, role: u.role, disabled: u.disabled, name: u.name }).from(u).where(eq(u.id, id)).for('update')
    if (!before) return null
    await tx.update(u).set(change).where(eq(u.id, id))
    await recordAudit(tx, admin, 'update-user', 'user', id, { before, change })
    const [after] = await tx.select({ id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled }).from(u).where(eq(u.id, id))
    return after
  })
  if (!updated) throw httpError(404, 'not_found', `There is no user with id ${id}.`)
  return { user: updated }
})
