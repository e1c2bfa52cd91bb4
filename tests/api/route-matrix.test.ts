// Every API route × every role: anonymous callers get 401, roles the route
// does not serve get 403, and the roles it serves get through. The last test
// fails if a route file exists that this table does not list.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { ROLES, type Role } from '../../shared/domain/enums'
import { Client, signedIn } from '../support/api'

interface Route { method: string, path: string, file: string, roles: readonly Role[] | 'public', body?: unknown, okStatus: number[] }

const ALL = ROLES
// Bodies for mutating routes are deliberately invalid, so an allowed caller
// gets a 400 and nothing changes; roles are checked before validation.
const ROUTES: Route[] = [
  { method: 'GET', path: '/api/health', file: 'health.get.ts', roles: 'public', okStatus: [200] },
  { method: 'GET', path: '/api/openapi.json', file: 'openapi.json.get.ts', roles: 'public', okStatus: [200] },
  { method: 'POST', path: '/api/auth/login', file: 'auth/login.post.ts', roles: 'public', body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/auth/forgot-password', file: 'auth/forgot-password.post.ts', roles: 'public', body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/auth/link', file: 'auth/link.post.ts', roles: 'public', body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/auth/set-password', file: 'auth/set-password.post.ts', roles: 'public', body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/auth/me', file: 'auth/me.get.ts', roles: ALL, okStatus: [200] },
  { method: 'POST', path: '/api/auth/logout', file: 'auth/logout.post.ts', roles: ALL, body: {}, okStatus: [200] },
  { method: 'POST', path: '/api/auth/password', file: 'auth/password.post.ts', roles: ALL, body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/users', file: 'users/index.get.ts', roles: ['admin'], okStatus: [200] },
  { method: 'POST', path: '/api/users', file: 'users/index.post.ts', roles: ['admin'], body: {}, okStatus: [400] },
  { method: 'PATCH', path: '/api/users/1', file: 'users/[id].patch.ts', roles: ['admin'], body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/outbox', file: 'outbox/index.get.ts', roles: ['admin'], okStatus: [200] },
  { method: 'GET', path: '/api/outbox/received', file: 'outbox/received.get.ts', roles: ['admin'], okStatus: [200] },
  { method: 'POST', path: '/api/outbox/999999999/retry', file: 'outbox/[id]/retry.post.ts', roles: ['admin'], body: {}, okStatus: [404] },
  { method: 'GET', path: '/api/codes', file: 'codes/index.get.ts', roles: ALL, okStatus: [200] },
  { method: 'GET', path: '/api/codes/oscillite', file: 'codes/[slug].get.ts', roles: ALL, okStatus: [200] },
  { method: 'GET', path: '/api/codes/oscillite/tokens', file: 'codes/[slug]/tokens.get.ts', roles: ['qa', 'admin'], okStatus: [200] },
  { method: 'POST', path: '/api/codes/oscillite/tokens', file: 'codes/[slug]/tokens.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/tokens/999999/revoke', file: 'tokens/[id]/revoke.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [404] },
  // no such versions: an allowed role gets past the role check to the 404
  { method: 'GET', path: '/api/codes/oscillite/compare?from=none-a&to=none-b&set=none', file: 'codes/[slug]/compare.get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/audit', file: 'audit/index.get.ts', roles: ['admin', 'viewer'], okStatus: [200] },
  { method: 'GET', path: '/api/reference-sets', file: 'reference-sets/index.get.ts', roles: ALL, okStatus: [200] },
  { method: 'GET', path: '/api/board', file: 'board.get.ts', roles: ALL, okStatus: [200] },
  { method: 'POST', path: '/api/reference-sets/preview', file: 'reference-sets/preview.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/reference-sets', file: 'reference-sets/index.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  // id 999999 does not exist: an allowed role gets past the role check to the 404 (GET) or the body check (PUT)
  { method: 'GET', path: '/api/reference-sets/999999', file: 'reference-sets/[id].get.ts', roles: ALL, okStatus: [404] },
  { method: 'PUT', path: '/api/reference-sets/999999', file: 'reference-sets/[id].put.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/reference-sets/999999/cases', file: 'reference-sets/[id]/cases.get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/reference-sets/999999/values', file: 'reference-sets/[id]/values.get.ts', roles: ALL, okStatus: [404] },
  { method: 'POST', path: '/api/submissions/preview', file: 'submissions/preview.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/runs', file: 'runs/index.post.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/runs/999999', file: 'runs/[id].get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/runs/999999/cases', file: 'runs/[id]/cases.get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/runs/999999/map', file: 'runs/[id]/map.get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/runs/999999/export', file: 'runs/[id]/export.get.ts', roles: ALL, okStatus: [404] },
  { method: 'GET', path: '/api/deviations', file: 'deviations/index.get.ts', roles: ALL, okStatus: [200] },
  { method: 'POST', path: '/api/deviations', file: 'deviations/index.post.ts', roles: ['owner', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/deviations/999999/approve', file: 'deviations/[id]/approve.post.ts', roles: ['qa', 'viewer', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/deviations/999999/reject', file: 'deviations/[id]/reject.post.ts', roles: ['qa', 'viewer', 'admin'], body: {}, okStatus: [400] },
  // the comment is optional when withdrawing, so an allowed caller reaches the 404
  { method: 'POST', path: '/api/deviations/999999/withdraw', file: 'deviations/[id]/withdraw.post.ts', roles: ['owner', 'admin'], body: {}, okStatus: [404] },
  { method: 'GET', path: '/api/codes/oscillite/required-sets', file: 'codes/[slug]/required-sets.get.ts', roles: ALL, okStatus: [200] },
  { method: 'PUT', path: '/api/codes/oscillite/required-sets', file: 'codes/[slug]/required-sets.put.ts', roles: ['qa', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/codes/oscillite/versions/2.3.0/sign-off', file: 'codes/[slug]/versions/[label]/sign-off.post.ts', roles: ['owner', 'admin'], body: {}, okStatus: [400] },
  { method: 'POST', path: '/api/codes/oscillite/versions/2.3.0/countersign', file: 'codes/[slug]/versions/[label]/countersign.post.ts', roles: ['viewer', 'admin'], body: {}, okStatus: [400] },
  { method: 'GET', path: '/api/codes/oscillite/versions/2.3.0/record', file: 'codes/[slug]/versions/[label]/record.get.ts', roles: ALL, okStatus: [200] },
  { method: 'GET', path: '/api/codes/oscillite/versions/2.3.0/record/export?format=junit', file: 'codes/[slug]/versions/[label]/record/export.get.ts', roles: ALL, okStatus: [200] },
]

const clients = new Map<Role, Client>()

beforeAll(async () => {
  for (const role of ROLES) clients.set(role, await signedIn(role))
})

async function call(client: Client, r: Route) {
  return client.request(r.method, r.path, r.body)
}

describe('route × role matrix', () => {
  const cases = ROUTES.flatMap(r => [
    { r, who: 'anonymous' as const },
    ...ROLES.map(role => ({ r, who: role })),
  ])

  it.each(cases.map(c => [`${c.r.method} ${c.r.path}`, c.who, c] as const))('%s as %s', async (_name, who, { r }) => {
    // logout ends the session it is called with, so it gets a client of its own
    const client = who === 'anonymous' ? new Client() : r.path === '/api/auth/logout' ? await signedIn(who) : clients.get(who)!
    const res = await call(client, r)
    if (r.roles === 'public') {
      expect(r.okStatus).toContain(res.status)
    }
    else if (who === 'anonymous') {
      expect(res.status).toBe(401)
      expect(res.body.data.code).toBe('unauthenticated')
    }
    else if (r.roles.includes(who)) {
      expect(r.okStatus).toContain(res.status)
    }
    else {
      expect(res.status).toBe(403)
      expect(res.body.message).toMatch(/needs the role/)
    }
  })

  it('lists every route file under server/api', () => {
    const apiDir = join(import.meta.dirname, '../../server/api')
    const walk = (dir: string): string[] => readdirSync(dir).flatMap((f) => {
      const p = join(dir, f)
      return statSync(p).isDirectory() ? walk(p) : [relative(apiDir, p)]
    })
    const files = walk(apiDir).sort()
    expect(files).toEqual(ROUTES.map(r => r.file).sort())
  })
})
