// Deny by default: every /api route needs a signed-in user unless it is listed
// here. Each route still checks its own roles (server/utils/auth.ts) and, where
// it takes one, the CI token (server/utils/access.ts).
const PUBLIC_API = new Set([
  'POST /api/auth/login',
  'POST /api/auth/forgot-password',
  'POST /api/auth/link',
  'POST /api/auth/set-password',
  'GET /api/health',
  'GET /api/openapi.json',
  'GET /api/_auth/session',
  'DELETE /api/_auth/session',
])

// Routes that also take a per-code CI token instead of a session; the route checks the token's code and scope.
const TOKEN_API: Array<[method: string, path: RegExp]> = [
  ['POST', /^\/api\/runs$/],
  ['GET', /^\/api\/runs\/\d+(\/(cases|export|map))?$/],
  ['GET', /^\/api\/board$/],
  ['GET', /^\/api\/codes(\/[a-z0-9-]+)?$/],
  ['GET', /^\/api\/codes\/[a-z0-9-]+\/versions\/[^/]+\/record(\/export)?$/],
]

export default defineEventHandler(async (event) => {
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  const route = `${event.method} ${path}`
  if (PUBLIC_API.has(route)) return
  if (bearerToken(event) && TOKEN_API.some(([m, re]) => m === event.method && re.test(path))) return
  await requireUser(event)
})
