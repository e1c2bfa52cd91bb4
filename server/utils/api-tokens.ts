// Per-code CI tokens. The token is never stored; its SHA-256 is. A token works
// only on its own code, only within its scope, and never once revoked or expired.
import { createHash } from 'node:crypto'
import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'

export function bearerToken(event: H3Event): string | null {
  const h = getRequestHeader(event, 'authorization')
  const m = h ? /^Bearer\s+(\S+)$/i.exec(h) : null
  return m ? m[1]! : null
}

export async function requireCodeToken(event: H3Event, codeId: number, scope: 'submit' | 'read') {
  const token = bearerToken(event)
  if (!token) throw httpError(401, 'unauthenticated', 'Sign in, or send a CI token as "Authorization: Bearer <token>".')
  const hash = createHash('sha256').update(token).digest('hex')
  const t = schema.apiTokens
  const [row] = await useDb().select().from(t).where(eq(t.tokenHash, hash))
  const now = Date.now()
  if (!row || row.revokedAt || (row.expiresAt && new Date(row.expiresAt).getTime() <= now)) {
    throw httpError(401, 'bad_token', 'This token is unknown, revoked or expired. Ask a verification engineer for a new one.')
  }
  if (row.codeId !== codeId) throw httpError(403, 'token_wrong_code', 'This token belongs to another code.')
  if (scope === 'submit' && row.scope !== 'submit') throw httpError(403, 'token_scope', 'This token may only read; submitting needs a token with the submit scope.')
  await useDb().update(t).set({ lastUsedAt: new Date() }).where(eq(t.id, row.id))
  return row
}
