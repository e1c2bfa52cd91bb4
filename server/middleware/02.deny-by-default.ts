// Deny by default: every /api route needs a signed-in user unless it is listed
// here. Each route still checks its own roles (server/utils/auth.ts).
const PUBLIC_API = new Set([
  'POST /api/auth/login',
  'GET /api/health',
  'GET /api/_auth/session',
  'DELETE /api/_auth/session',
])

export default defineEventHandler(async (event) => {
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  if (PUBLIC_API.has(`${event.method} ${path}`)) return
  await requireUser(event)
})
