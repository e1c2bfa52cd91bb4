import { eq } from 'drizzle-orm'
import { idParamSchema } from '../../../../shared/schemas/auth'

// Revoke a CI token at once; it stays listed, with the time it was revoked.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'admin')
  const { id } = validParams(event, idParamSchema)
  const t = schema.apiTokens
  const found = await useDb().transaction(async (tx) => {
    const [row] = await tx.select().from(t).where(eq(t.id, id)).for('update')
    if (!row) return false
    if (!row.revokedAt) {
      await tx.update(t).set({ revokedAt: new Date() }).where(eq(t.id, id))
      await recordAudit(tx, user, 'revoke-token', 'api-token', id, { prefix: row.prefix, name: row.name })
    }
    return true
  })
  if (!found) throw httpError(404, 'not_found', `There is no token with id ${id}.`)
  const [token] = await listTokens({ id })
  return { token }
})
