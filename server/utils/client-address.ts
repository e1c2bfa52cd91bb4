import type { H3Event } from 'h3'

/** The caller's address. X-Forwarded-For is read only when NUXT_TRUST_PROXY=true (behind a known load balancer). */
export function clientAddress(event: H3Event): string {
  const trust = String(useRuntimeConfig().trustProxy) === 'true'
  return getRequestIP(event, { xForwardedFor: trust }) ?? 'unknown'
}
