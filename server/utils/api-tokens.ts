// Per-code CI tokens. The token is never stored; its SHA-256 is. A token works
// only on its own code, only within its scope, and never once revoked or expired.
import { createHash, randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import type { ApiToken } from '../database/schema'

export type TokenScope = ApiToken['scope']

export function bearerToken(event: H3Event): string | null {
  const h = getRequestHeader(event, 'authorization')
  const m = h ? /^Bearer\s+(\S+)$/i.exec(h) : null
  return m ? m[1]! : null
}

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')

/** A new secret: `plb_` and 32 random base64url characters; the prefix is what lists show. */
export function newTokenSecret(): { secret: string, prefix: string, hash: string } {
  const secret = `plb_${randomBytes(24).toString('base64url')}`
  return { secret, prefix: secret.slice(0, 12), hash: hashToken(secret) }
}

export function tokenState(t: Pick<ApiToken, 'revokedAt' | 'expiresAt'>, now = Date.now()): 'active' | 'revoked' | 'expired' {
  if (t.revokedAt) return 'revoked'
  if (t.expiresAt && new Date(t.expiresAt).getTime() <= now) return 'expired'
  return 'active'
}

/** The bearer token of this request, checked for being live and of one of `scopes`; its last use is recorded. */
export async function requireTokenOf(event: H3Event, scopes: readonly TokenScope[]): Promise<ApiToken> {
  const token = bearerToken(event)
  if (!token) throw httpError(401, 'unauthenticated', 'Sign in, or send a CI token as "Authorization: Bearer <token>".')
  const t = schema.apiTokens
  const [row] = await useDb().select().from(t).where(eq(t.tokenHash, hashToken(token)))
  if (!row || tokenState(row) !== 'active') {
    throw httpError(401, 'bad_token', 'This token is unknown, revoked or expired. Ask a verification engineer for a new one.')
  }
  if (!scopes.includes(row.scope)) {
    throw httpError(403, 'token_scope', scopes.includes('submit')
      ? 'This token may only read; submitting needs a token with the submit scope.'
      : 'This token may only submit tables and read back its code\'s runs; reading this needs a token with the read scope.')
  }
  await useDb().update(t).set({ lastUsedAt: new Date() }).where(eq(t.id, row.id))
  return row
}
