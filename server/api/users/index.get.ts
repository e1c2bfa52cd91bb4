import { asc } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const u = schema.users
  const rows = await useDb()
    .select({ id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled, createdAt: u.createdAt })
    .from(u)
    .orderBy(asc(u.email))
  return { users: rows }
})
