// Deny by default: every /api route needs a signed-in user unless it is listed
// here. Each route still checks its own roles (server/utils/auth.ts).
const PUBLIC_API = new Set([
  'POST /api/auth/login',
  'GET /api/health',
  'GET /api/_auth/session',
  'DELETE /api/_auth/session',
])

// Routes that also take a per-code CI token instead of a session; the route itself checks the token.
const TOKEN_API = new Set(['POST /api/runs'])

export default defineEventHandler(async (event) => {
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  const route = `${event.method} ${path}`
  if (PUBLIC_API.has(route)) return
  if (TOKEN_API.has(route) && bearerToken(event)) return
  await requireUser(event)
})
