import routes from '#plumbline/api-routes'

// Any /api path no route serves gets a JSON 404, and a path served only for
// other methods a 405 naming them (with Allow), instead of the page renderer's
// HTML. Runs after deny-by-default, so anonymous callers still get 401 first.
const patterns = routes.map(r => ({ method: r.method, re: new RegExp(`^${r.route.replace(/[.+?^$()|[\]\\]/g, '\\$&').replace(/:[^/]+/g, '[^/]+')}$`) }))

export default defineEventHandler((event) => {
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  const matching = patterns.filter(p => p.re.test(path))
  if (matching.some(p => p.method === 'ALL' || p.method === event.method || (event.method === 'HEAD' && p.method === 'GET'))) return
  const allowed = [...new Set(matching.map(p => p.method))]
  if (allowed.length) {
    setResponseHeader(event, 'allow', allowed.join(', '))
    throw httpError(405, 'method_not_allowed', `${event.method} is not served on ${path}; it takes ${allowed.join(', ')}.`, { allow: allowed })
  }
  throw httpError(404, 'no_such_route', `There is no API route ${event.method} ${path}. The routes are described at /api/openapi.json and on the API page.`)
})
