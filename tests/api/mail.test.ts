// Mail through the outbox, the worker and the local SMTP catcher: each kind of
// message really arrives over SMTP with a text and an HTML part; invitation
// and reset links work once and expire; with the SMTP server away, runs still
// store and their mail waits in the outbox until it is back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDb, createPool } from '../../server/database/client'
import { queueDeviationApprovalRequest, queueRunFailureNotice, queueSignOffNotice } from '../../server/mail/notifications'
import { Client, demoUser, signedIn, unique } from '../support/api'
import { caughtMessages, linkSecret, plantGivenUpMail, smtp, waitForMail } from '../support/mail'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'
import { dbQuery as sql } from '../support/db'

let admin: Client
let qa: Client
let set: { id: number, slug: string }
const pool = createPool(process.env.NUXT_DATABASE_URL!)
const db = createDb(pool)


const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
const table = (bad: (n: number, x: string) => boolean = () => false) =>
  ['n,x,H', ...NS.flatMap(n => XS.map(x => `${n},${x},${(hermiteDouble(n, Number(x)) * (bad(n, x) ? 1 + 1e-8 : 1)).toPrecision(17)}`))].join('\n') + '\n'

function bothParts(m: { text: string, html: string }) {
  expect(m.text.length).toBeGreaterThan(50)
  expect(m.html).toMatch(/^<!doctype html>/i)
  expect(m.html).toContain('Plumbline')
}

async function invite(role = 'viewer') {
  const email = `${unique('invitee')}@example.test`
  const r = await admin.post('/api/users', { email, name: 'Ivo Tarrant', role })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  expect(r.body.invited).toBe(true)
  const [m] = await waitForMail(x => x.to === email && x.kind === 'invitation')
  return { id: r.body.user.id as number, email, message: m! }
}

beforeAll(async () => {
  admin = await signedIn('admin')
  qa = await signedIn('qa')
  set = await readySet(qa, hermiteSet(unique('mail-set')))
})
afterAll(async () => {
  await smtp('start')
  await pool.end()
})

describe('invitation', () => {
  it('arrives over SMTP with both parts, and its link sets the password once', async () => {
    const { email, message } = await invite('qa')
    bothParts(message)
    expect(message.subject).toBe('Your Plumbline account: choose a password')
    expect(message.text).toMatch(/Ada Marrow has made you an account/)
    const { secret, url } = linkSecret(message.text)
    expect(message.html).toContain(url)
    expect(url.startsWith(`${process.env.PLUMBLINE_APP_URL}/set-password#token=`)).toBe(true)
    // only the hash is stored
    const rows = await sql<{ token_hash: string }>('SELECT t.token_hash FROM user_tokens t JOIN users u ON u.id = t.user_id WHERE u.email = ?', [email])
    expect(rows).toHaveLength(1)
    expect(rows[0]!.token_hash).not.toContain(secret)

    const c = new Client()
    expect((await c.login(email, 'chosen-password-1')).status).toBe(401)
    const check = await c.post('/api/auth/link', { token: secret })
    expect(check.body).toMatchObject({ purpose: 'invite', email })
    expect((await c.post('/api/auth/set-password', { token: secret, password: 'short' })).body.data.issues[0].field).toBe('password')
    const set1 = await c.post('/api/auth/set-password', { token: secret, password: 'chosen-password-1' })
    expect(set1.status, JSON.stringify(set1.body)).toBe(200)
    expect((await c.login(email, 'chosen-password-1')).status).toBe(200)
    const again = await new Client().post('/api/auth/set-password', { token: secret, password: 'another-password-2' })
    expect(again.status).toBe(410)
    expect(again.body.data.code).toBe('link_used')
    expect((await new Client().login(email, 'another-password-2')).status).toBe(401)
  })

  it('refuses an expired invitation and an unknown link', async () => {
    const { id, message } = await invite()
    await sql('UPDATE user_tokens SET expires_at = NOW(3) - INTERVAL 1 SECOND WHERE user_id = ?', [id])
    const { secret } = linkSecret(message.text)
    const r = await new Client().post('/api/auth/set-password', { token: secret, password: 'chosen-password-1' })
    expect(r.status).toBe(410)
    expect(r.body.data.code).toBe('link_expired')
    expect(r.body.message).toMatch(/Ask an administrator to send a new one/)
    const unknown = await new Client().post('/api/auth/link', { token: 'x'.repeat(43) })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.code).toBe('link_unknown')
  })
})

describe('password reset', () => {
  it('answers the same for known and unknown addresses, and mails only the known one', async () => {
    const { email, message } = await invite()
    await new Client().post('/api/auth/set-password', { token: linkSecret(message.text).secret, password: 'first-password-1' })
    const nobody = `${unique('nobody')}@example.test`
    const known = await new Client().post('/api/auth/forgot-password', { email })
    const unknown = await new Client().post('/api/auth/forgot-password', { email: nobody })
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    expect(unknown.body).toEqual(known.body)
    const [reset] = await waitForMail(m => m.to === email && m.kind === 'password-reset')
    bothParts(reset!)
    expect((await sql('SELECT id FROM mail_outbox WHERE to_address = ?', [nobody]))).toHaveLength(0)

    // a session that was open before the reset ends with it
    const before = new Client()
    expect((await before.login(email, 'first-password-1')).status).toBe(200)
    const c = new Client()
    expect((await c.post('/api/auth/link', { token: linkSecret(reset!.text).secret })).body.purpose).toBe('reset')
    expect((await c.post('/api/auth/set-password', { token: linkSecret(reset!.text).secret, password: 'second-password-2' })).status).toBe(200)
    expect((await new Client().login(email, 'first-password-1')).status).toBe(401)
    expect((await new Client().login(email, 'second-password-2')).status).toBe(200)
    expect((await before.get('/api/auth/me')).status).toBe(401)
    expect((await c.post('/api/auth/set-password', { token: linkSecret(reset!.text).secret, password: 'third-password-3' })).status).toBe(410)
  })

  it('names a bad address', async () => {
    const r = await new Client().post('/api/auth/forgot-password', { email: 'not an address' })
    expect(r.status).toBe(400)
    expect(r.body.data.issues[0].field).toBe('email')
  })
})

describe('failure notice', () => {
  const owner = demoUser('owner').email

  it('goes to the code\'s owners when a run has failures, with the worst cases and a link', async () => {
    const version = unique('fail')
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: 'f.csv', content: table((n, x) => n === 12 && x !== '0') })
    expect(r.status).toBe(201)
    const [m] = await waitForMail(x => x.to === owner && x.kind === 'run-failure' && x.subject.includes(version))
    bothParts(m!)
    expect(m!.subject).toBe(`Oscillite ${version}: 4 cases of 20 fail against ${set.slug} r1`)
    expect(m!.text).toContain(`${process.env.PLUMBLINE_APP_URL}/runs/${r.body.run.id}`)
    expect(m!.text).toMatch(/n=12 x=-?(1|0\.5) \(line \d+\) +fail/)
    expect(m!.text).toMatch(/does not replace your organisation's QA programme/)
  })

  it('is not sent for a clean run, nor for a code without owners', async () => {
    const clean = unique('clean')
    expect((await upload(qa, '/api/runs', { code: 'oscillite', version: clean, setId: String(set.id) }, { name: 'c.csv', content: table() })).status).toBe(201)
    const ownerless = unique('noowner')
    expect((await upload(qa, '/api/runs', { code: 'modeforge', version: ownerless, setId: String(set.id) }, { name: 'm.csv', content: table(() => true) })).status).toBe(201)
    expect(await sql('SELECT id FROM mail_outbox WHERE subject LIKE ? OR subject LIKE ?', [`%${clean}%`, `%${ownerless}%`])).toHaveLength(0)
  })

  it('is sent for a run flagged as a regression even when its cases pass', async () => {
    const version = unique('regr')
    const r = await upload(qa, '/api/runs', { code: 'quadrat', version, setId: String(set.id) }, { name: 'c.csv', content: table() })
    await sql('UPDATE runs SET is_regression = 1 WHERE id = ?', [r.body.run.id])
    expect(await queueRunFailureNotice(db, r.body.run.id)).toBe(1)
    const [m] = await waitForMail(x => x.to === owner && x.subject.includes(version))
    expect(m!.subject).toBe(`Quadrat ${version}: regression against ${set.slug} r1`)
    expect(m!.text).toMatch(/marked as a regression/)
  })
})

describe('deviation and sign-off notices', () => {
  it('asks the owners and verification engineers, not the proposer, to approve a deviation', async () => {
    const [code] = await sql<{ id: number }>('SELECT id FROM codes WHERE slug = ?', ['oscillite'])
    const [proposer] = await sql<{ id: number }>('SELECT id FROM users WHERE email = ?', [demoUser('owner').email])
    const reason = `Known loss near the zeros of H_12 (${unique('dev')})`
    const { insertId: id } = await sql('INSERT INTO deviations (code_id, set_slug, scope, region, reason, proposed_by, expires_at_version) VALUES (?, ?, ?, ?, ?, ?, ?)', [code!.id, set.slug, 'region', 'all', reason, proposer!.id, '3.0.0']) as unknown as { insertId: number }
    const n = await queueDeviationApprovalRequest(db, id)
    expect(n).toBeGreaterThanOrEqual(1)
    const got = await waitForMail(m => m.kind === 'deviation-approval' && m.text.includes(reason), n)
    expect(got.map(m => m.to)).toContain(demoUser('qa').email)
    expect(got.map(m => m.to)).not.toContain(demoUser('owner').email)
    bothParts(got[0]!)
    expect(got[0]!.subject).toBe(`Approval asked: deviation ${id} on Oscillite, set ${set.slug}`)
    expect(got[0]!.text).toMatch(/expire at version 3\.0\.0/)
    expect(got[0]!.text).toMatch(/cannot approve it/)
  })

  it('tells the owners and readers, not the signer, that a version was signed', async () => {
    const [v] = await sql<{ id: number, label: string }>('SELECT v.id, v.label FROM versions v JOIN codes c ON c.id = v.code_id WHERE c.slug = ? ORDER BY v.id LIMIT 1', ['quadrat'])
    const [signer] = await sql<{ id: number }>('SELECT id FROM users WHERE email = ?', [demoUser('qa').email])
    const comment = `All required sets pass (${unique('sig')})`
    const { insertId: id } = await sql('INSERT INTO sign_offs (version_id, user_id, kind, run_ids, summary, comment) VALUES (?, ?, ?, ?, ?, ?)', [v!.id, signer!.id, 'sign', JSON.stringify([1, 2]), JSON.stringify({}), comment]) as unknown as { insertId: number }
    const n = await queueSignOffNotice(db, id)
    const got = await waitForMail(m => m.kind === 'sign-off' && m.text.includes(comment), n)
    const to = got.map(m => m.to)
    expect(to).toContain(demoUser('owner').email)
    expect(to).toContain(demoUser('viewer').email)
    expect(to).not.toContain(demoUser('qa').email)
    bothParts(got[0]!)
    expect(got[0]!.subject).toBe(`Quadrat ${v!.label} signed by Quentin Sorrel`)
    expect(got[0]!.text).toMatch(/having seen 2 runs/)
    expect(got[0]!.text).toMatch(/may now countersign/)
  })
})

describe('with the SMTP server away', () => {
  it('stores the run, keeps its mail queued with the error, and delivers it once the server is back', async () => {
    await smtp('stop')
    try {
      const version = unique('offline')
      const r = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: 'o.csv', content: table((n, x) => n === 8 && x === '1') })
      expect(r.status).toBe(201)
      expect((await qa.get(`/api/runs/${r.body.run.id}`)).body.run.summary.counts.fail).toBe(1)
      let row: { state: string, attempts: number, last_error: string | null } | undefined
      for (let i = 0; i < 100; i++) {
        [row] = await sql<{ state: string, attempts: number, last_error: string | null }>('SELECT state, attempts, last_error FROM mail_outbox WHERE subject LIKE ?', [`%${version}%`])
        if (row && row.attempts >= 2) break
        await new Promise(res => setTimeout(res, 200))
      }
      expect(row).toMatchObject({ state: 'queued' })
      expect(row!.attempts).toBeGreaterThanOrEqual(2)
      expect(row!.last_error).toMatch(/ECONNREFUSED|connect/i)
      expect((await caughtMessages()).filter(m => m.subject.includes(version))).toHaveLength(0)
      const outbox = await admin.get('/api/outbox')
      expect(outbox.body.messages.find((m: { subject: string }) => m.subject.includes(version))).toMatchObject({ state: 'queued', kind: 'run-failure' })

      await smtp('start')
      const [m] = await waitForMail(x => x.subject.includes(version))
      expect(m!.to).toBe(demoUser('owner').email)
      const [after] = await sql<{ state: string, last_error: string | null }>('SELECT state, last_error FROM mail_outbox WHERE subject LIKE ?', [`%${version}%`])
      expect(after).toMatchObject({ state: 'sent', last_error: null })
    }
    finally {
      await smtp('start')
    }
  })

  it('sends again, on an administrator\'s word, a message the worker gave up on', async () => {
    const subject = unique('Given up')
    const id = await plantGivenUpMail(demoUser('owner').email, subject)
    expect((await qa.post(`/api/outbox/${id}/retry`)).status).toBe(403)
    const r = await admin.post(`/api/outbox/${id}/retry`)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body).toEqual({ id, state: 'queued' })
    const [m] = await waitForMail(x => x.subject === subject)
    expect(m!.outboxId).toBe(id)
    let row: { state: string, attempts: number } | undefined
    for (let i = 0; i < 50 && row?.state !== 'sent'; i++) {
      [row] = await sql<{ state: string, attempts: number }>('SELECT state, attempts FROM mail_outbox WHERE id = ?', [id])
      if (row?.state !== 'sent') await new Promise(res => setTimeout(res, 200))
    }
    expect(row).toEqual({ state: 'sent', attempts: 1 })
    const audit = await sql<{ action: string, actor: string }>('SELECT action, actor FROM audit_log WHERE object_type = ? AND object_id = ?', ['mail', String(id)])
    expect(audit).toEqual([{ action: 'requeue-mail', actor: demoUser('admin').email }])

    const again = await admin.post(`/api/outbox/${id}/retry`)
    expect(again.status).toBe(409)
    expect(again.body.data.code).toBe('not_failed')
    expect(again.body.message).toMatch(/is sent; only a message the worker gave up on/)
    expect((await admin.post('/api/outbox/999999999/retry')).status).toBe(404)
  })

  it('lets an administrator read what the catcher received, with both parts', async () => {
    const r = await admin.get('/api/outbox/received')
    expect(r.status).toBe(200)
    expect(r.body.reachable).toBe(true)
    const inv = r.body.messages.find((m: { kind: string }) => m.kind === 'invitation')
    expect(inv.text).toMatch(/choose your password/i)
    expect(inv.html).toMatch(/<a href=/)
    expect((await admin.get('/api/outbox?state=sent')).body.messages.every((m: { state: string }) => m.state === 'sent')).toBe(true)
  })
})
