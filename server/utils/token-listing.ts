// Reading tokens back for lists: every field but the secret, which is never stored.
import { asc, eq } from 'drizzle-orm'
import type { ApiTokenListing } from '../../shared/schemas/api-token'

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null)

export async function listTokens(where: { codeId?: number, id?: number }): Promise<ApiTokenListing[]> {
  const t = schema.apiTokens
  const rows = await useDb()
    .select({ token: t, by: schema.users.email })
    .from(t)
    .leftJoin(schema.users, eq(schema.users.id, t.createdBy))
    .where(where.id !== undefined ? eq(t.id, where.id) : eq(t.codeId, where.codeId!))
    .orderBy(asc(t.id))
  return rows.map(({ token, by }) => ({
    id: token.id,
    name: token.name,
    scope: token.scope,
    prefix: token.prefix,
    demoOnly: token.demoOnly,
    state: tokenState(token),
    expiresAt: iso(token.expiresAt),
    revokedAt: iso(token.revokedAt),
    lastUsedAt: iso(token.lastUsedAt),
    createdBy: by,
    createdAt: iso(token.createdAt)!,
  }))
}
