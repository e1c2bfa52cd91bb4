import { and, count, desc, eq, type SQL } from 'drizzle-orm'
import { auditQuerySchema } from '../../../shared/schemas/audit'
import type { AuditPage } from '../../../shared/domain/api-types'

// The audit trail, newest first. Read-only by design: the table is
// append-only in the database (triggers in drizzle/0001) and no route
// changes or removes an entry.
export default defineEventHandler(async (event): Promise<AuditPage> => {
  await requireRole(event, 'admin', 'viewer')
  const q = validQuery(event, auditQuerySchema)
  const db = useDb()
  const a = schema.auditLog
  const parts: SQL[] = []
  if (q.objectType) parts.push(eq(a.objectType, q.objectType))
  if (q.objectId) parts.push(eq(a.objectId, q.objectId))
  const where = parts.length ? and(...parts) : undefined
  const [total] = await db.select({ n: count() }).from(a).where(where)
  const rows = await db.select({ id: a.id, at: a.at, actor: a.actor, userName: schema.users.name, action: a.action, objectType: a.objectType, objectId: a.objectId, detail: a.detail })
    .from(a).leftJoin(schema.users, eq(schema.users.id, a.userId))
    .where(where).orderBy(desc(a.id)).limit(q.pageSize).offset((q.page - 1) * q.pageSize)
  const types = await db.selectDistinct({ t: a.objectType }).from(a).orderBy(a.objectType)
  return {
    total: total?.n ?? 0, page: q.page, pageSize: q.pageSize,
    objectTypes: types.map(t => t.t),
    rows: rows.map(r => ({ ...r, at: new Date(r.at).toISOString() })),
  }
})
