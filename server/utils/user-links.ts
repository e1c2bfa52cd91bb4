// Checking a set-password link (invitation or reset) by its secret.
import { eq, sql } from 'drizzle-orm'
import type { Tx } from './audit'
import { hashLinkSecret } from '../mail/user-links'

/** The live link and its user, or the error a person can act on (400 unknown, 410 used or expired, 403 disabled account). */
export async function liveLink(db: Tx | ReturnType<typeof useDb>, secret: string, lock = false) {
  const t = schema.userTokens
  const q = db.select({ link: t, expired: sql<number>`${t.expiresAt} <= NOW(3)`, user: { id: schema.users.id, email: schema.users.email, name: schema.users.name, role: schema.users.role, disabled: schema.users.disabled } })
    .from(t).innerJoin(schema.users, eq(schema.users.id, t.userId)).where(eq(t.tokenHash, hashLinkSecret(secret)))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw httpError(400, 'link_unknown', 'This link is not valid. Open it again from the message, whole, or ask for a new one.')
  if (row.link.usedAt) throw httpError(410, 'link_used', 'This link has been used already; each link works once. Sign in, or ask for a new link.')
  if (Number(row.expired)) {
    throw httpError(410, 'link_expired', row.link.purpose === 'invite'
      ? 'This invitation has expired. Ask an administrator to send a new one.'
      : 'This link has expired. Ask for a new one on the sign-in page.')
  }
  if (row.user.disabled) throw httpError(403, 'account_disabled', 'This account is disabled. Ask an administrator to enable it.')
  return row
}
