// Role helpers. Every route calls one of these first; the role comes from the
// database on each request, so a disabled user, a changed role or a new
// password takes effect at once, whatever the session cookie says.
import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import type { Role } from '../../shared/domain/enums'
import type { User } from '../database/schema'

export type CurrentUser = Pick<User, 'id' | 'email' | 'name' | 'role'>

/** The signed-in, enabled user, or a 401. */
export async function requireUser(event: H3Event): Promise<CurrentUser> {
  const cached = event.context.currentUser as CurrentUser | undefined
  if (cached) return cached
  const session = await getUserSession(event)
  const sessionUser = session.user
  if (!sessionUser?.id) {
    throw httpError(401, 'unauthenticated', 'Sign in to use this.')
  }
  const db = useDb()
  const [row] = await db
    .select({ id: schema.users.id, email: schema.users.email, name: schema.users.name, role: schema.users.role, disabled: schema.users.disabled, passwordChangedAt: schema.users.passwordChangedAt })
    .from(schema.users)
    .where(eq(schema.users.id, sessionUser.id))
  if (!row || row.disabled) {
    await clearUserSession(event)
    throw httpError(401, 'unauthenticated', 'Your account is not active. Ask an administrator.')
  }
  // a password chosen after this session began ends it (the session that chose it is renewed)
  const signedInAt = typeof session.loggedInAt === 'number' ? session.loggedInAt : 0
  if (row.passwordChangedAt && signedInAt < row.passwordChangedAt.getTime()) {
    await clearUserSession(event)
    throw httpError(401, 'unauthenticated', 'The password of this account was changed after you signed in. Sign in again.')
  }
  const user: CurrentUser = { id: row.id, email: row.email, name: row.name, role: row.role }
  event.context.currentUser = user
  return user
}

/** The signed-in user if their role is one of `roles`, else 403 (401 when anonymous). */
export async function requireRole(event: H3Event, ...roles: Role[]): Promise<CurrentUser> {
  const user = await requireUser(event)
  if (!roles.includes(user.role)) {
    throw httpError(403, 'forbidden', `This needs the role ${roles.join(' or ')}; you are signed in as ${user.role}.`)
  }
  return user
}

export const ANY_ROLE: Role[] = ['admin', 'qa', 'owner', 'viewer']
