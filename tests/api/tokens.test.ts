// Per-code CI tokens: issued once and stored only as a hash, listed without the
// secret, scoped to one code and one scope, refused with 401 once revoked or
// expired, and their last use recorded.
import { createHash } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { Client, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'
import { dbQuery as sql } from '../support/db'

let qa: Client
let admin: Client
let set: { id: number }
let quadratRunId: number

const table = ['n,x,H', ...[0, 4, 8, 12].flatMap(n => ['-1', '-0.5', '0', '0.5', '1'].map(x => `${n},${x},${hermiteDouble(n, Number(x)).toPrecision(17)}`))].join('\n') + '\n'


/** A client that sends only a bearer token, as CI does. */
function bearer(token: string) {
  const c = new Client()
  return {
    get: (path: string) => c.request('GET', path, undefined, { authorization: `Bearer ${token}`, origin: '' }),
    submit: async (code: string) => {
      const form = new FormData()
      form.append('code', code)
      form.append('version', unique('tok'))
      form.append('setId', String(set.id))
      form.append('file', new Blob([table]), 'ci.csv')
      const res = await fetch(`${c.base}/api/runs`, { method: 'POST', body: form, headers: { authorization: `Bearer ${token}` } })
      return { status: res.status, body: await res.json() }
    },
  }
}

async function issue(client: Client, code: string, body: Record<string, unknown>) {
  const r = await client.post(`/api/codes/${code}/tokens`, body)
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body as { secret: string, token: { id: number, prefix: string, scope: string, state: string } }
}

beforeAll(async () => {
  qa = await signedIn('qa')
  admin = await signedIn('admin')
  set = await readySet(qa, hermiteSet(unique('tok-set')))
  const r = await upload(qa, '/api/runs', { code: 'quadrat', version: unique('q'), setId: String(set.id) }, { name: 'q.csv', content: table })
  expect(r.status).toBe(201)
  quadratRunId = r.body.run.id
})

describe('issuing and listing', () => {
  it('shows the secret once and stores only its SHA-256', async () => {
    const { secret, token } = await issue(qa, 'oscillite', { name: 'nightly', scope: 'submit' })
    expect(secret).toMatch(/^plb_[\w-]{32}$/)
    expect(secret.startsWith(token.prefix)).toBe(true)
    const [row] = await sql<Record<string, unknown>>('SELECT * FROM api_tokens WHERE id = ?', [token.id])
    expect(row!.token_hash).toBe(createHash('sha256').update(secret).digest('hex'))
    for (const v of Object.values(row!)) expect(String(v)).not.toContain(secret)
    const audit = await sql('SELECT detail FROM audit_log WHERE action = ? AND object_id = ?', ['issue-token', String(token.id)])
    expect(JSON.stringify(audit)).not.toContain(secret)
  })

  it('lists tokens without any secret and refuses an expiry in the past', async () => {
    const { secret } = await issue(admin, 'oscillite', { name: 'listed', scope: 'read' })
    const list = await qa.get('/api/codes/oscillite/tokens')
    expect(list.status).toBe(200)
    expect(list.body.tokens.some((t: { name: string }) => t.name === 'listed')).toBe(true)
    expect(JSON.stringify(list.body)).not.toContain(secret)
    expect(JSON.stringify(list.body)).not.toMatch(/hash/i)
    const past = await qa.post('/api/codes/oscillite/tokens', { name: 'old', scope: 'read', expiresAt: '2001-01-01T00:00:00Z' })
    expect(past.status).toBe(400)
    expect(past.body.data.issues[0].field).toBe('expiresAt')
    const noScope = await qa.post('/api/codes/oscillite/tokens', { name: 'x', scope: 'write' })
    expect(noScope.body.data.issues[0]).toMatchObject({ field: 'scope', message: 'Choose submit or read.' })
    expect((await qa.post('/api/codes/nosuchcode/tokens', { name: 'x', scope: 'read' })).status).toBe(404)
  })
})

describe('scope and code isolation', () => {
  it('a submit token posts for its own code only, reads back its runs, and reads nothing else', async () => {
    const { secret } = await issue(qa, 'oscillite', { name: 'submitter', scope: 'submit' })
    const ci = bearer(secret)
    const ok = await ci.submit('oscillite')
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    expect((await ci.get(`/api/runs/${ok.body.run.id}`)).status).toBe(200)
    expect((await ci.get(`/api/runs/${ok.body.run.id}/cases?pageSize=5`)).body.total).toBe(20)
    expect((await ci.get(`/api/runs/${ok.body.run.id}/export?format=json`)).body.cases).toHaveLength(20)
    const other = await ci.submit('quadrat')
    expect(other.status).toBe(403)
    expect(other.body.data.code).toBe('token_wrong_code')
    const otherRun = await ci.get(`/api/runs/${quadratRunId}`)
    expect(otherRun.status).toBe(403)
    expect(otherRun.body.data.code).toBe('token_wrong_code')
    const board = await ci.get('/api/board')
    expect(board.status).toBe(403)
    expect(board.body.data.code).toBe('token_scope')
  })

  it('a read token sees its own code on the board and code routes, and cannot submit', async () => {
    const { secret } = await issue(qa, 'quadrat', { name: 'reader', scope: 'read' })
    const ci = bearer(secret)
    const board = await ci.get('/api/board')
    expect(board.status).toBe(200)
    expect(board.body.codes.map((c: { slug: string }) => c.slug)).toEqual(['quadrat'])
    const codes = await ci.get('/api/codes')
    expect(codes.body.codes.map((c: { slug: string }) => c.slug)).toEqual(['quadrat'])
    expect((await ci.get('/api/codes/quadrat')).status).toBe(200)
    expect((await ci.get('/api/codes/oscillite')).body.data.code).toBe('token_wrong_code')
    expect((await ci.get(`/api/runs/${quadratRunId}/cases`)).status).toBe(200)
    const post = await ci.submit('quadrat')
    expect(post.status).toBe(403)
    expect(post.body.data.code).toBe('token_scope')
  })

  it('a token opens no route outside the CI ones', async () => {
    const { secret } = await issue(qa, 'oscillite', { name: 'nosy', scope: 'read' })
    const r = await bearer(secret).get('/api/users')
    expect(r.status).toBe(401)
    expect(r.body.data.code).toBe('unauthenticated')
    expect((await bearer(secret).get('/api/codes/oscillite/tokens')).status).toBe(401)
  })
})

describe('revoked, expired and last use', () => {
  it('records the last use', async () => {
    const { secret, token } = await issue(qa, 'oscillite', { name: 'used', scope: 'read' })
    const before = (await qa.get('/api/codes/oscillite/tokens')).body.tokens.find((t: { id: number }) => t.id === token.id)
    expect(before.lastUsedAt).toBeNull()
    expect((await bearer(secret).get('/api/board')).status).toBe(200)
    const after = (await qa.get('/api/codes/oscillite/tokens')).body.tokens.find((t: { id: number }) => t.id === token.id)
    expect(after.lastUsedAt).not.toBeNull()
  })

  it('refuses a revoked token with 401 and keeps it listed as revoked', async () => {
    const { secret, token } = await issue(qa, 'oscillite', { name: 'to revoke', scope: 'submit' })
    expect((await bearer(secret).submit('oscillite')).status).toBe(201)
    const rev = await qa.post(`/api/tokens/${token.id}/revoke`)
    expect(rev.status).toBe(200)
    expect(rev.body.token.state).toBe('revoked')
    const refused = await bearer(secret).submit('oscillite')
    expect(refused.status).toBe(401)
    expect(refused.body.data.code).toBe('bad_token')
    expect((await bearer(secret).get('/api/runs/1')).status).toBe(401)
    expect((await qa.post('/api/tokens/999999/revoke')).status).toBe(404)
  })

  it('refuses an expired token with 401', async () => {
    const { secret, token } = await issue(qa, 'quadrat', { name: 'short-lived', scope: 'read', expiresAt: new Date(Date.now() + 3600_000).toISOString() })
    expect((await bearer(secret).get('/api/board')).status).toBe(200)
    await sql('UPDATE api_tokens SET expires_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?', [token.id])
    const r = await bearer(secret).get('/api/board')
    expect(r.status).toBe(401)
    expect(r.body.data.code).toBe('bad_token')
    const listed = (await qa.get('/api/codes/quadrat/tokens')).body.tokens.find((t: { id: number }) => t.id === token.id)
    expect(listed.state).toBe('expired')
  })
})
