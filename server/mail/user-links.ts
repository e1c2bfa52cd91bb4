// Single-use links that let a person choose a password: an invitation when an
// administrator adds them, or a reset they asked for. The link carries a random
// secret; user_tokens keeps only its SHA-256, with an expiry and the time of use.
import { createHash, randomBytes } from 'node:crypto'
import { sql } from 'drizzle-orm'
import { userTokens } from '../database/schema'
import type { Writer } from './outbox'

export type LinkPurpose = 'invite' | 'reset'

export const LINK_HOURS: Record<LinkPurpose, number> = { invite: 72, reset: 1 }

export const hashLinkSecret = (secret: string) => createHash('sha256').update(secret).digest('hex')

/** A new link secret for the user, stored hashed; returns the secret and its expiry. */
export async function createUserLink(db: Writer, userId: number, purpose: LinkPurpose): Promise<{ secret: string, expiresAt: Date }> {
  const secret = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + LINK_HOURS[purpose] * 3600_000)
  await db.insert(userTokens).values({ userId, purpose, tokenHash: hashLinkSecret(secret), expiresAt: sql`NOW(3) + INTERVAL ${LINK_HOURS[purpose] * 3600} SECOND` as unknown as Date })
  return { secret, expiresAt }
}

/** The page that takes the link: the secret rides in the fragment, so it never reaches a server log. */
export const setPasswordUrl = (appUrl: string, secret: string) => `${appUrl}/set-password#token=${secret}`
