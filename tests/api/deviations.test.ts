// Deviations against the real server and MariaDB: propose, approve, reject,
// withdraw, expiry by date and by version, the two-person rule, and what an
// approved deviation does to a run, its cases and the board (the stored
// verdicts never change).
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteSet, readySet } from '../support/sets'
import { freshMinor, sql, submitTable, tableFromSet } from '../support/records'
import { waitForMail } from '../support/mail'

let qa: Client, owner: Client, viewer: Client, admin: Client
let set: { id: number, slug: string }
let runV1 = 0
const minor = freshMinor()
const V1 = `60.${minor}.0`

// n ∈ {0,4,8,12} × x ∈ {-1,…,1}; region high-n holds n ≥ 8.
const spoil = (i: Record<string, string>) =>
  (i.n === '4' && i.x === '0.5') || (i.n === '8' && i.x === '0.5') || (i.n === '12' && i.x === '1') ? 'off' as const
    : i.n === '12' && i.x === '-1' ? 'nan' as const : null

const propose = (c: Client, over: Record<string, unknown>) => c.post('/api/deviations', {
  code: 'oscillite', set: set.slug, scope: 'set', reason: 'Known loss of accuracy in the recurrence; fix planned.', expiresOn: '2099-01-01', ...over,
})
const runCounts = async (id: number) => (await viewer.get(`/api/runs/${id}`)).body.run

beforeAll(async () => {
  ;[qa, owner, viewer, admin] = await Promise.all([signedIn('qa'), signedIn('owner'), signedIn('viewer'), signedIn('admin')])
  const tol = { kind: 'ulps', maxUlps: '4' }
  set = await readySet(qa, hermiteSet(unique('dev-set'), {
    criterion: { format: 'binary64', tolerance: tol, regions: [{ name: 'high-n', when: [{ param: 'n', op: 'atLeast', value: '8' }], tolerance: tol }], zero: { below: '1e-300', atol: '1e-300' }, overflow: { signedInf: 'pass' } },
  }))
  runV1 = await submitTable(qa, 'oscillite', V1, set.id, await tableFromSet(qa, set.id, spoil))
  const run = await runCounts(runV1)
  expect(run.summary.counts).toMatchObject({ fail: 3, non_finite: 1, accepted: 0 })
})

describe('proposing', () => {
  it('asks a verification engineer to approve, by mail, never the proposer', async () => {
    const reason = `Cancellation near the zeros; fix planned (${unique('mail')}).`
    const res = await propose(owner, { reason })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const got = await waitForMail(m => m.kind === 'deviation-approval' && m.text.includes(reason))
    expect(got.map(m => m.to)).toContain('qa@corrie-point.test')
    expect(got.map(m => m.to)).not.toContain('owner@corrie-point.test')
    expect(got[0]!.text).toContain('/deviations?code=oscillite')
    expect((await owner.post(`/api/deviations/${res.body.deviation.id}/withdraw`, { comment: 'Only a mail check.' })).status).toBe(200)
  })

  it('refuses callers who are not owners of the code, and bad proposals with the field named', async () => {
    expect((await propose(viewer, {})).status).toBe(403)
    expect((await propose(qa, {})).status).toBe(403)
    const notMine = await propose(owner, { code: 'modeforge' })
    expect(notMine.status).toBe(403)
    expect(notMine.body.data.code).toBe('not_code_owner')
    const noCase = await propose(owner, { scope: 'case', inputs: { n: '5', x: '0.5' } })
    expect(noCase.status).toBe(400)
    expect(noCase.body.data.issues[0].field).toBe('inputs')
    const noRegion = await propose(owner, { scope: 'region', region: 'tiny-x' })
    expect(noRegion.status).toBe(400)
    expect(noRegion.body.message).toMatch(/high-n/)
    const twoExpiries = await propose(owner, { expiresAtVersion: '9.0.0' })
    expect(twoExpiries.status).toBe(400)
    expect(twoExpiries.body.data.issues[0].field).toBe('expiresAtVersion')
    const past = await propose(owner, { expiresOn: '2001-01-01' })
    expect(past.status).toBe(400)
    expect(past.body.data.issues[0].field).toBe('expiresOn')
  })
})

describe('a case deviation, approved', () => {
  let id = 0
  it('is proposed for the exact inputs, whatever their spelling, and changes nothing yet', async () => {
    const res = await propose(owner, { scope: 'case', inputs: { n: '4', x: '0.50' } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    id = res.body.deviation.id
    expect(res.body.deviation).toMatchObject({ state: 'proposed', standing: 'proposed', caseInputKey: 'n=4;x=0.5', proposedBy: { email: 'owner@corrie-point.test' } })
    expect((await runCounts(runV1)).summary.counts.fail).toBe(3)
  })

  it('is approved by qa with a comment; the failure reads as accepted, the stored verdict stays fail', async () => {
    expect((await qa.post(`/api/deviations/${id}/approve`, {})).status).toBe(400) // a comment is required
    const res = await qa.post(`/api/deviations/${id}/approve`, { comment: 'Reviewed against the release plan.' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.deviation).toMatchObject({ state: 'approved', decidedBy: { email: 'qa@corrie-point.test' }, decisionComment: 'Reviewed against the release plan.' })
    const run = await runCounts(runV1)
    expect(run.summary.counts).toMatchObject({ fail: 2, accepted: 1, non_finite: 1 })
    expect(run.storedCounts).toMatchObject({ fail: 3, accepted: 0 })
    expect(run.deviations).toEqual([expect.objectContaining({ id, scope: 'case', accepted: 1 })])
    expect(run.regions.all.counts).toMatchObject({ fail: 0, accepted: 1 })
    const accepted = await viewer.get(`/api/runs/${runV1}/cases?verdict=accepted`)
    expect(accepted.body.rows).toEqual([expect.objectContaining({ inputs: { n: '4', x: '0.5' }, verdict: 'accepted', storedVerdict: 'fail', acceptedBy: id })])
    expect((await viewer.get(`/api/runs/${runV1}/cases?verdict=fail`)).body.total).toBe(2)
    const stored = await sql<{ n: number }>('SELECT COUNT(*) AS n FROM case_results WHERE run_id = ? AND verdict = \'fail\'', [runV1])
    expect(Number(stored[0]!.n)).toBe(3)
  })

  it('cannot be approved twice, and every step is in the audit trail', async () => {
    const again = await viewer.post(`/api/deviations/${id}/approve`, { comment: 'Once more.' })
    expect(again.status).toBe(409)
    expect(again.body.data.code).toBe('not_proposed')
    const audit = await sql<{ action: string, actor: string }>('SELECT action, actor FROM audit_log WHERE object_type = \'deviation\' AND object_id = ? ORDER BY id', [String(id)])
    expect(audit).toEqual([{ action: 'propose-deviation', actor: 'owner@corrie-point.test' }, { action: 'approve-deviation', actor: 'qa@corrie-point.test' }])
  })
})

describe('region deviations: rejected, approved, withdrawn', () => {
  it('a rejected one changes nothing and cannot be approved afterwards', async () => {
    const id = (await propose(owner, { scope: 'region', region: 'high-n' })).body.deviation.id
    const res = await viewer.post(`/api/deviations/${id}/reject`, { comment: 'Fix it instead.' })
    expect(res.status).toBe(200)
    expect(res.body.deviation).toMatchObject({ state: 'rejected', decidedBy: { email: 'viewer@corrie-point.test' } })
    expect((await runCounts(runV1)).summary.counts.fail).toBe(2)
    expect((await qa.post(`/api/deviations/${id}/approve`, { comment: 'Changed my mind.' })).status).toBe(409)
  })

  it('an approved one accepts the region\'s failures but not the non-finite one; withdrawing it stops that', async () => {
    const id = (await propose(owner, { scope: 'region', region: 'high-n' })).body.deviation.id
    expect((await viewer.post(`/api/deviations/${id}/approve`, { comment: 'Accepted for this release.' })).status).toBe(200)
    let run = await runCounts(runV1)
    expect(run.summary.counts).toMatchObject({ fail: 0, accepted: 3, non_finite: 1 })
    expect(run.regions['high-n'].counts).toMatchObject({ fail: 0, accepted: 2, non_finite: 1 })
    expect(run.state).toBe('failed') // the non-finite case still fails
    const board = await viewer.get(`/api/board?code=oscillite&set=${set.slug}`)
    const cell = board.body.codes[0].versions.find((v: { label: string }) => v.label === V1).cells[0]
    expect(cell).toMatchObject({ state: 'failed', failures: 1 })

    const notMine = await admin.post(`/api/deviations/${id}/withdraw`, { comment: 'Not yours.' })
    expect(notMine.status).toBe(403)
    expect(notMine.body.data.code).toBe('not_proposer')
    const res = await owner.post(`/api/deviations/${id}/withdraw`, { comment: 'The fix landed.' })
    expect(res.status).toBe(200)
    expect(res.body.deviation).toMatchObject({ state: 'withdrawn', decidedBy: { email: 'viewer@corrie-point.test' } })
    expect(res.body.deviation.history.map((h: { action: string }) => h.action)).toEqual(['propose-deviation', 'approve-deviation', 'withdraw-deviation'])
    run = await runCounts(runV1)
    expect(run.summary.counts).toMatchObject({ fail: 2, accepted: 1 })
    expect((await owner.post(`/api/deviations/${id}/withdraw`, {})).status).toBe(409)
    // withdrawn, never deleted
    expect((await viewer.get(`/api/deviations?code=oscillite&set=${set.slug}&state=withdrawn`)).body.deviations.map((d: { id: number }) => d.id)).toContain(id)
  })
})

describe('two-person rule', () => {
  it('refuses an admin who approves their own proposal with 403 and says why', async () => {
    const id = (await propose(admin, { scope: 'set' })).body.deviation.id
    const res = await admin.post(`/api/deviations/${id}/approve`, { comment: 'Looks fine to me.' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('two_person_rule')
    expect(res.body.message).toMatch(/You proposed deviation \d+, so you may not approve it: a second person/)
    expect((await admin.post(`/api/deviations/${id}/reject`, { comment: 'No.' })).body.data.code).toBe('two_person_rule')
    expect((await admin.post(`/api/deviations/${id}/withdraw`, { comment: 'Proposed by mistake.' })).status).toBe(200)
  })

  it('refuses a proposer whose role has since become qa', async () => {
    const email = `${unique('proposer')}@corrie-point.test`
    const made = await admin.post('/api/users', { email, name: 'Temporary proposer', role: 'owner', password: 'proposer-pass-2026' })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const userId = made.body.user.id
    await sql('INSERT INTO code_owners (code_id, user_id) SELECT id, ? FROM codes WHERE slug = \'oscillite\'', [userId])
    const them = new (owner.constructor as typeof Client)()
    expect((await them.login(email, 'proposer-pass-2026')).status).toBe(200)
    const id = (await propose(them, { scope: 'case', inputs: { n: '8', x: '0.5' } })).body.deviation.id
    expect((await admin.patch(`/api/users/${userId}`, { role: 'qa' })).status).toBe(200)
    const res = await them.post(`/api/deviations/${id}/approve`, { comment: 'Approving my own.' })
    expect(res.status).toBe(403)
    expect(res.body.data.code).toBe('two_person_rule')
    // leave the demo code's owners and the active users as they were
    await sql('DELETE FROM code_owners WHERE user_id = ?', [userId])
    expect((await admin.patch(`/api/users/${userId}`, { disabled: true })).status).toBe(200)
  })
})

describe('expiry', () => {
  it('by date: an approved deviation past its date stops applying and says so; a proposed one past it cannot be approved', async () => {
    // Dates in the past cannot be proposed through the API, so these rows are written as if time had passed.
    const [code] = await sql<{ id: number }>('SELECT id FROM codes WHERE slug = \'oscillite\'')
    const [me] = await sql<{ id: number }>('SELECT id FROM users WHERE email = \'owner@corrie-point.test\'')
    const [them] = await sql<{ id: number }>('SELECT id FROM users WHERE email = \'qa@corrie-point.test\'')
    await sql('INSERT INTO deviations (code_id, set_slug, scope, reason, state, proposed_by, decided_by, decided_at, decision_comment, expires_on) VALUES (?, ?, \'set\', \'Accepted until last month.\', \'approved\', ?, ?, NOW(3), \'ok\', \'2026-01-01\')', [code!.id, set.slug, me!.id, them!.id])
    await sql('INSERT INTO deviations (code_id, set_slug, scope, reason, state, proposed_by, expires_on) VALUES (?, ?, \'set\', \'Never settled in time.\', \'proposed\', ?, \'2026-01-01\')', [code!.id, set.slug, me!.id])
    const list = (await viewer.get(`/api/deviations?code=oscillite&set=${set.slug}&state=expired`)).body.deviations
    expect(list).toHaveLength(1)
    expect(list[0]).toMatchObject({ state: 'approved', standing: 'expired', reason: 'Accepted until last month.' })
    expect((await runCounts(runV1)).summary.counts).toMatchObject({ fail: 2, accepted: 1 }) // only the case deviation
    const stale = (await viewer.get(`/api/deviations?code=oscillite&set=${set.slug}&state=proposed`)).body.deviations.find((d: { reason: string }) => d.reason === 'Never settled in time.')
    const res = await qa.post(`/api/deviations/${stale.id}/approve`, { comment: 'Too late.' })
    expect(res.status).toBe(409)
    expect(res.body.data.code).toBe('expired')
  })

  it('by version: applies to versions before the expiry label, not to it or later ones', async () => {
    const q = (k: number) => `61.${minor}.${k}`
    const table = await tableFromSet(qa, set.id, i => (i.n === '4' && i.x === '1' ? 'off' : null))
    const before = await submitTable(qa, 'quadrat', q(0), set.id, table)
    const id = (await owner.post('/api/deviations', { code: 'quadrat', set: set.slug, scope: 'set', reason: 'Accepted until the 2 release of this line.', expiresAtVersion: q(2) })).body.deviation.id
    expect((await viewer.post(`/api/deviations/${id}/approve`, { comment: 'Agreed.' })).status).toBe(200)
    const at = await submitTable(qa, 'quadrat', q(2), set.id, table)
    const after = await submitTable(qa, 'quadrat', q(3), set.id, table)
    const board = await viewer.get(`/api/board?code=quadrat&set=${set.slug}`)
    const cellOf = (label: string) => board.body.codes[0].versions.find((v: { label: string }) => v.label === label).cells[0]
    expect(cellOf(q(0))).toMatchObject({ state: 'accepted', runId: before, failures: 0 })
    expect(cellOf(q(2))).toMatchObject({ state: 'failed', runId: at, failures: 1 })
    expect(cellOf(q(3))).toMatchObject({ state: 'failed', runId: after, failures: 1 })
    expect((await runCounts(before)).deviations[0]).toMatchObject({ id, accepted: 1 })
    expect((await runCounts(after)).deviations).toEqual([])
    // the deviation on quadrat does nothing for oscillite
    expect((await runCounts(runV1)).summary.counts.fail).toBe(2)
  })
})

describe('the database keeps deviations', () => {
  it('refuses deleting one and changing what was proposed', async () => {
    const [row] = await sql<{ id: number }>('SELECT id FROM deviations WHERE state = \'approved\' ORDER BY id LIMIT 1')
    await expect(sql('DELETE FROM deviations WHERE id = ?', [row!.id])).rejects.toThrow(/withdraw a deviation instead/)
    await expect(sql('UPDATE deviations SET reason = \'rewritten\' WHERE id = ?', [row!.id])).rejects.toThrow(/keep their history/)
    await expect(sql('UPDATE deviations SET state = \'proposed\' WHERE id = ? AND state <> \'proposed\'', [row!.id])).rejects.toThrow(/keep their history/)
  })
})
