import { createConnection } from 'mysql2/promise'
import { beforeAll, describe, expect, it } from 'vitest'
import { Client, demoUser, signedIn, unique } from '../support/api'

let admin: Client

async function newUser(role = 'viewer', password = 'first-password-1') {
  const email = `${unique('user')}@example.test`
  const r = await admin.post('/api/users', { email, name: 'Test Person', role, password })
  expect(r.status).toBe(201)
  return { id: r.body.user.id as number, email, password }
}

beforeAll(async () => {
  admin = await signedIn('admin')
})

describe('sign-in', () => {
  it('signs in with the right password and sets an HttpOnly, SameSite session cookie', async () => {
    const c = new Client()
    const u = demoUser('qa')
    const res = await c.login(u.email, u.password)
    expect(res.status).toBe(200)
    expect(res.body.user).toMatchObject({ email: u.email, role: 'qa' })
    const cookie = res.headers.getSetCookie().find(h => h.startsWith('plumbline-session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    const me = await c.get('/api/auth/me')
    expect(me.body.user.role).toBe('qa')
  })

  it('refuses a wrong password with 401 and no session', async () => {
    const c = new Client('10.9.0.1')
    const res = await c.login(demoUser('viewer').email, 'not-the-password')
    expect(res.status).toBe(401)
    expect(res.body.data.code).toBe('bad_credentials')
    expect((await c.get('/api/auth/me')).status).toBe(401)
  })

  it('names the failing field when the body is invalid', async () => {
    const res = await new Client().post('/api/auth/login', { email: 'not an address', password: '' })
    expect(res.status).toBe(400)
    expect(res.body.data.issues.map((i: { field: string }) => i.field).sort()).toEqual(['email', 'password'])
    expect(res.body.message).toMatch(/email: Enter a valid e-mail address/)
  })

  it('limits failed attempts per account, even with the right password afterwards', async () => {
    const u = await newUser()
    const c = new Client('10.9.1.1')
    for (let i = 0; i < 5; i++) expect((await c.login(u.email, 'wrong-password')).status).toBe(401)
    const blocked = await c.login(u.email, u.password)
    expect(blocked.status).toBe(429)
    expect(blocked.body.data).toMatchObject({ code: 'rate_limited', scope: 'account' })
    // another account from another address is not affected
    expect((await new Client('10.9.1.2').login(demoUser('viewer').email, demoUser('viewer').password)).status).toBe(200)
  })

  it('limits failed attempts per address across accounts', async () => {
    const c = new Client('10.9.2.1')
    for (let i = 0; i < 20; i++) {
      expect((await c.login(`${unique('nobody')}@example.test`, 'wrong-password')).status).toBe(401)
    }
    const u = await newUser()
    const blocked = await c.login(u.email, u.password)
    expect(blocked.status).toBe(429)
    expect(blocked.body.data.scope).toBe('address')
    expect((await new Client('10.9.2.2').login(u.email, u.password)).status).toBe(200)
  })

  it('refuses a disabled user, and ends a session they already had', async () => {
    const u = await newUser('owner')
    const c = new Client()
    expect((await c.login(u.email, u.password)).status).toBe(200)
    expect((await admin.patch(`/api/users/${u.id}`, { disabled: true })).status).toBe(200)
    expect((await c.get('/api/board')).status).toBe(401)
    const again = await new Client().login(u.email, u.password)
    expect(again.status).toBe(403)
    expect(again.body.data.code).toBe('account_disabled')
  })

  it('applies a role change at once, whatever the cookie says', async () => {
    const u = await newUser('viewer')
    const c = new Client()
    await c.login(u.email, u.password)
    expect((await c.get('/api/users')).status).toBe(403)
    await admin.patch(`/api/users/${u.id}`, { role: 'admin' })
    expect((await c.get('/api/users')).status).toBe(200)
  })

  it('signs out', async () => {
    const c = await signedIn('viewer')
    expect((await c.post('/api/auth/logout')).status).toBe(200)
    expect((await c.get('/api/auth/me')).status).toBe(401)
  })
})

describe('cross-origin requests', () => {
  it('refuses a POST whose Origin is another site', async () => {
    const res = await admin.request('POST', '/api/users', { email: 'x@example.test', name: 'X', role: 'qa', password: 'long-enough-1' }, { origin: 'http://elsewhere.example' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('cross_origin')
  })

  it('refuses a POST marked cross-site by the browser even without Origin', async () => {
    const res = await admin.request('POST', '/api/auth/logout', {}, { 'origin': '', 'sec-fetch-site': 'cross-site' })
    expect(res.status).toBe(403)
    expect((await admin.get('/api/auth/me')).status).toBe(200)
  })

  it('lets same-origin and non-browser clients through', async () => {
    const res = await admin.request('PATCH', '/api/users/1', {}, { origin: '' })
    expect(res.status).toBe(400)
  })
})

describe('own password', () => {
  it('changes the password after checking the current one', async () => {
    const u = await newUser('qa')
    const c = new Client()
    await c.login(u.email, u.password)
    const wrong = await c.post('/api/auth/password', { currentPassword: 'not-it', newPassword: 'second-password-2' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.issues[0].field).toBe('currentPassword')
    const short = await c.post('/api/auth/password', { currentPassword: u.password, newPassword: 'short' })
    expect(short.status).toBe(400)
    expect(short.body.data.issues[0].field).toBe('newPassword')
    expect((await c.post('/api/auth/password', { currentPassword: u.password, newPassword: 'second-password-2' })).status).toBe(200)
    expect((await new Client().login(u.email, u.password)).status).toBe(401)
    expect((await new Client().login(u.email, 'second-password-2')).status).toBe(200)
  })

  it('ends every other session of the account, and keeps the one that changed it', async () => {
    const u = await newUser('owner')
    const here = new Client()
    const elsewhere = new Client()
    await here.login(u.email, u.password)
    await elsewhere.login(u.email, u.password)
    expect((await elsewhere.get('/api/auth/me')).status).toBe(200)
    expect((await here.post('/api/auth/password', { currentPassword: u.password, newPassword: 'second-password-2' })).status).toBe(200)
    expect((await here.get('/api/auth/me')).status).toBe(200)
    expect((await here.get('/api/board')).status).toBe(200)
    const ended = await elsewhere.get('/api/board')
    expect(ended.status).toBe(401)
    expect(ended.body.message).toMatch(/password of this account was changed after you signed in/)
    // it stays ended until it signs in again, with the new password
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401)
    expect((await elsewhere.login(u.email, 'second-password-2')).status).toBe(200)
    expect((await elsewhere.get('/api/board')).status).toBe(200)
  })
})

describe('users', () => {
  it('refuses a second account for the same address with 409', async () => {
    const u = await newUser()
    const res = await admin.post('/api/users', { email: u.email.toUpperCase(), name: 'Twin', role: 'qa', password: 'long-enough-1' })
    expect(res.status).toBe(409)
    expect(res.body.data.issues[0].field).toBe('email')
  })

  it('names the role field when the role is unknown', async () => {
    const res = await admin.post('/api/users', { email: 'r@example.test', name: 'R', role: 'superuser', password: 'long-enough-1' })
    expect(res.status).toBe(400)
    expect(res.body.data.issues.map((i: { field: string }) => i.field)).toEqual(['role'])
  })

  it('will not let an admin disable themselves', async () => {
    const me = await admin.get('/api/auth/me')
    const res = await admin.patch(`/api/users/${me.body.user.id}`, { disabled: true })
    expect(res.status).toBe(400)
  })

  it('returns 404 for a user that does not exist', async () => {
    expect((await admin.patch('/api/users/999999', { name: 'Nobody' })).status).toBe(404)
  })

  it('records every change in the audit trail, which the database keeps append-only', async () => {
    const u = await newUser()
    await admin.patch(`/api/users/${u.id}`, { role: 'qa' })
    const conn = await createConnection(process.env.NUXT_DATABASE_URL!)
    try {
      const [rows] = await conn.query('SELECT action, detail FROM audit_log WHERE object_type = ? AND object_id = ? ORDER BY id', ['user', String(u.id)])
      expect((rows as { action: string }[]).map(r => r.action)).toEqual(['create-user', 'update-user'])
      await expect(conn.query('UPDATE audit_log SET action = ? WHERE object_id = ?', ['tampered', String(u.id)])).rejects.toThrow(/append-only/)
      await expect(conn.query('DELETE FROM audit_log WHERE object_id = ?', [String(u.id)])).rejects.toThrow(/append-only/)
    }
    finally {
      await conn.end()
    }
  })
})
