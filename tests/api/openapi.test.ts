// The OpenAPI document: valid by a general-purpose validator, and in step with
// the route files: every route file is either documented or listed below as
// internal (a page-only route), and every documented path has its file.
// Also: unknown API routes and wrong methods answer in JSON.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import SwaggerParser from '@apidevtools/swagger-parser'
import { beforeAll, describe, expect, it } from 'vitest'
import { Client, signedIn } from '../support/api'

/** Routes the pages use that are not part of the public API. */
const INTERNAL = new Set([
  'POST /api/auth/login', 'POST /api/auth/logout', 'GET /api/auth/me', 'POST /api/auth/password',
  'POST /api/auth/forgot-password', 'POST /api/auth/link', 'POST /api/auth/set-password',
  'GET /api/users', 'POST /api/users', 'PATCH /api/users/{id}',
  'POST /api/reference-sets', 'PUT /api/reference-sets/{id}', 'POST /api/reference-sets/preview',
  'POST /api/submissions/preview',
  'GET /api/outbox', 'GET /api/outbox/received', 'POST /api/outbox/{id}/retry',
  // deviations, required sets and signatures are settled by people on the pages; the audit trail is read there
  'GET /api/deviations', 'POST /api/deviations', 'POST /api/deviations/{id}/approve', 'POST /api/deviations/{id}/reject', 'POST /api/deviations/{id}/withdraw',
  'GET /api/codes/{slug}/required-sets', 'PUT /api/codes/{slug}/required-sets',
  'POST /api/codes/{slug}/versions/{label}/sign-off', 'POST /api/codes/{slug}/versions/{label}/countersign',
  'GET /api/audit',
])

function routeFiles(): string[] {
  const apiDir = join(import.meta.dirname, '../../server/api')
  const walk = (dir: string): string[] => readdirSync(dir).flatMap((f) => {
    const p = join(dir, f)
    return statSync(p).isDirectory() ? walk(p) : [relative(apiDir, p)]
  })
  return walk(apiDir).map((file) => {
    const m = /^(.*?)\.(get|post|put|patch|delete)\.ts$/.exec(file)
    if (!m) throw new Error(`route file ${file} names no method`)
    const path = `/api/${m[1]!.replace(/(^|\/)index$/, '')}`.replace(/\/$/, '').replace(/\[(\w+)\]/g, '{$1}')
    return `${m[2]!.toUpperCase()} ${path}`
  })
}

let doc: { paths: Record<string, Record<string, { 'x-plumbline-planned'?: boolean, 'x-plumbline-access': { roles: unknown, tokenScopes?: string[] } }>> }

beforeAll(async () => {
  const r = await new Client().get('/api/openapi.json')
  expect(r.status).toBe(200)
  doc = r.body
})

describe('the OpenAPI document', () => {
  it('is served to anyone and validates as OpenAPI 3.1', async () => {
    expect((doc as unknown as { openapi: string }).openapi).toBe('3.1.0')
    await expect(SwaggerParser.validate(structuredClone(doc) as never)).resolves.toBeTruthy()
  })

  it('covers every route file that is not internal, and only routes that exist', () => {
    const files = new Set(routeFiles())
    const documented = Object.entries(doc.paths).flatMap(([path, ops]) => Object.entries(ops).map(([m, op]) => ({ key: `${m.toUpperCase()} ${path}`, planned: op['x-plumbline-planned'] === true })))
    const undocumented = [...files].filter(f => !INTERNAL.has(f) && !documented.some(d => d.key === f))
    expect(undocumented, 'document these in server/openapi/document.ts, or list them as internal in this test').toEqual([])
    const missing = documented.filter(d => !d.planned && !files.has(d.key)).map(d => d.key)
    expect(missing, 'documented paths without a route file').toEqual([])
    const landed = documented.filter(d => d.planned && files.has(d.key)).map(d => d.key)
    expect(landed, 'these planned routes exist now: drop x-plumbline-planned').toEqual([])
    expect(documented.filter(d => INTERNAL.has(d.key)).map(d => d.key)).toEqual([])
    for (const key of ['POST /api/runs', 'GET /api/runs/{id}', 'GET /api/runs/{id}/cases', 'GET /api/runs/{id}/export', 'GET /api/board', 'GET /api/codes', 'GET /api/health']) {
      expect(documented.map(d => d.key)).toContain(key)
    }
  })

  it('documents token access the server really grants', async () => {
    const qa = await signedIn('qa')
    const read = (await qa.post('/api/codes/oscillite/tokens', { name: 'openapi check', scope: 'read' })).body.secret as string
    const c = new Client()
    for (const [path, ops] of Object.entries(doc.paths)) {
      const op = ops.get
      if (!op || op['x-plumbline-planned']) continue
      const required = (op as { parameters?: Array<{ in: string, name: string, required?: boolean, schema?: { enum?: string[] } }> }).parameters?.filter(p => p.in === 'query' && p.schema?.enum) ?? []
      const query = required.length ? `?${required.map(p => `${p.name}=${p.schema!.enum![0]}`).join('&')}` : ''
      const url = path.replace('{id}', '999999').replace('{slug}', 'oscillite').replace('{label}', '0.0.0-none') + query
      const r = await c.request('GET', url, undefined, { authorization: `Bearer ${read}` })
      const takesRead = op['x-plumbline-access'].tokenScopes?.includes('read') ?? false
      if (op['x-plumbline-access'].roles === 'public') expect(r.status, url).toBe(200)
      else if (takesRead) expect([200, 404], url).toContain(r.status)
      else expect(r.status, url).toBe(401)
    }
  })
})

describe('unknown API routes', () => {
  it('answer 404 in JSON with a stable code, and a wrong method 405 with Allow', async () => {
    const viewer = await signedIn('viewer')
    const none = await viewer.get('/api/no-such-thing')
    expect(none.status).toBe(404)
    expect(none.headers.get('content-type')).toMatch(/json/)
    expect(none.body.data.code).toBe('no_such_route')
    expect(none.body.message).toMatch(/openapi\.json/)
    const wrong = await viewer.request('DELETE', '/api/board')
    expect(wrong.status).toBe(405)
    expect(wrong.headers.get('allow')).toBe('GET')
    expect(wrong.body.data).toMatchObject({ code: 'method_not_allowed', allow: ['GET'] })
    const runs = await viewer.request('PUT', '/api/runs/12')
    expect(runs.status).toBe(405)
    expect(runs.body.data.allow).toEqual(['GET'])
    const anon = await new Client().get('/api/no-such-thing')
    expect(anon.status).toBe(401)
    expect(anon.body.data.code).toBe('unauthenticated')
  })
})
