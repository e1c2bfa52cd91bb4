// Refuse state-changing requests that a browser sends from another origin
// (cross-site request forgery). Bearer-token clients send no cookies and are
// not affected; requests without Origin or Fetch metadata (curl, CI) pass.
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

export default defineEventHandler((event) => {
  if (SAFE.has(event.method)) return
  const origin = getRequestHeader(event, 'origin')
  const fetchSite = getRequestHeader(event, 'sec-fetch-site')
  if (origin && origin !== 'null') {
    const host = getRequestHeader(event, 'x-forwarded-host') && String(useRuntimeConfig().trustProxy) === 'true'
      ? getRequestHeader(event, 'x-forwarded-host')
      : getRequestHeader(event, 'host')
    const originHost = URL.canParse(origin) ? new URL(origin).host : ''
    if (originHost && originHost === host) return
  }
  else if (!fetchSite || fetchSite === 'same-origin' || fetchSite === 'none') {
    if (origin !== 'null') return
  }
  throw httpError(403, 'cross_origin', 'Refused: this request came from another site. Use Plumbline from its own pages or an API token.')
})
