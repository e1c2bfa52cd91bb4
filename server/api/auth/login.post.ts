import { eq } from 'drizzle-orm'
import { loginSchema } from '../../../shared/schemas/auth'

// Public route: the one way in. Validation runs first here because there is no session to check yet.
export default defineEventHandler(async (event) => {
  const { email, password } = await validBody(event, loginSchema)
  const address = clientAddress(event)
  await assertLoginAllowed(email, address)

  const db = useDb()
  const [user] = await db.select().from(schema.users).where(eq(schema.users.email, email))
  const ok = user?.passwordHash ? await verifyPassword(user.passwordHash, password) : false
  if (!user || !ok) {
    await recordLoginAttempt(email, address, false)
    throw httpError(401, 'bad_credentials', 'The e-mail address or password is wrong.')
  }
  if (user.disabled) {
    await recordLoginAttempt(email, address, false)
    throw httpError(403, 'account_disabled', 'This account is disabled. Ask an administrator to enable it.')
  }
  await recordLoginAttempt(email, address, true)
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role }
  await replaceUserSession(event, { user: sessionUser, loggedInAt: Date.now() })
  await recordAudit(db, sessionUser, 'sign-in', 'user', user.id)
  return { user: sessionUser }
})
