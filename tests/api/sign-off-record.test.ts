// Sign-off and the verification record against the real server and MariaDB:
// required sets, the preconditions of signing, countersigning and its
// two-person rule, supersession by a later run (and the triggers that keep
// signatures append-only), and the record with its JSON, CSV and JUnit XML
// exports (the XML read back with a general-purpose XML parser).
import { XMLParser } from 'fast-xml-parser'
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteSet, readySet, upload } from '../support/sets'
import { freshMinor, sql, submitTable, tableFromSet } from '../support/records'
import { waitForMail } from '../support/mail'

let qa: Client, owner: Client, viewer: Client, admin: Client
let setA: { id: number, slug: string, caseCount: number }
let setB: { id: number, slug: string, caseCount: number }
// Quadrat, owned by the demo owner; version labels of this test's own
const code = 'quadrat'
const minor = freshMinor()
const V = `80.${minor}.0`
const V2 = `80.${minor}.1`
const V3 = `80.${minor}.2`
const base = () => `/api/codes/${code}`
const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)
const offAt = (n: string, x: string) => (i: Record<string, string>) => (i.n === n && i.x === x ? 'off' as const : null)

beforeAll(async () => {
  ;[qa, owner, viewer, admin] = await Promise.all([signedIn('qa'), signedIn('owner'), signedIn('viewer'), signedIn('admin')])
  setA = await readySet(qa, hermiteSet(unique('sign-a'), { source: 'Plumbline engine; spot values checked against A&S Table 22.12' }))
  setB = await readySet(qa, hermiteSet(unique('sign-b')))
})

describe('required sets', () => {
  it('are chosen by qa; unknown sets are refused by position; others may only read them', async () => {
    expect((await owner.request('PUT', `${base()}/required-sets`, { sets: [setA.slug] })).status).toBe(403)
    const bad = await qa.request('PUT', `${base()}/required-sets`, { sets: [setA.slug, 'no-such-set'] })
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues[0].field).toBe('sets.1')
    const ok = await qa.request('PUT', `${base()}/required-sets`, { sets: [setB.slug, setA.slug] })
    expect(ok.status).toBe(200)
    expect(ok.body.sets).toEqual([setA.slug, setB.slug].sort())
    expect((await viewer.get(`${base()}/required-sets`)).body.sets).toEqual([setA.slug, setB.slug].sort())
  })
})

describe('signing a version', () => {
  let signatureId = 0
  let runB = 0
  it('is refused with 409 naming the required sets that have no run yet', async () => {
    const env = { compiler: 'gfortran 13.2', flags: '-O2', platform: 'x86_64-linux', floatFormat: 'binary64' }
    const r = await upload(qa, '/api/runs', { code, version: V, setId: String(setA.id), commit: 'a1b2c3d', environment: JSON.stringify(env) }, { name: 'a.csv', content: await tableFromSet(qa, setA.id, offAt('4', '0.5')) })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const res = await owner.post(`${base()}/versions/${V}/sign-off`, { comment: 'Reviewed the results.' })
    expect(res.status).toBe(409)
    expect(res.body.data).toMatchObject({ code: 'required_sets_missing', missing: [setB.slug] })
    expect(res.body.message).toContain(setB.slug)
  })

  it('is recorded with the runs and summary the owner saw, once', async () => {
    runB = await submitTable(qa, code, V, setB.id, await tableFromSet(qa, setB.id))
    expect((await viewer.post(`${base()}/versions/${V}/sign-off`, { comment: 'Not mine to sign.' })).status).toBe(403)
    const res = await owner.post(`${base()}/versions/${V}/sign-off`, { comment: 'Reviewed: one known failure in set A.' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    signatureId = res.body.signOff.id
    // the notice of the signature reaches a viewer over SMTP, with a link to the record
    const [notice] = await waitForMail(m => m.kind === 'sign-off' && m.to === 'viewer@corrie-point.test' && m.text.includes('Reviewed: one known failure in set A.'))
    expect(notice!.text).toContain(`/records/${code}/${encodeURIComponent(V)}`)
    const [row] = await sql<{ run_ids: string, summary: string, kind: string }>('SELECT run_ids, summary, kind FROM sign_offs WHERE id = ?', [signatureId])
    expect(row!.kind).toBe('sign')
    expect(json(row!.run_ids)).toContain(runB)
    const summary = json(row!.summary) as Array<{ slug: string, required: boolean, run: { id: number, counts: Record<string, number> } }>
    expect(summary.find(s => s.slug === setA.slug)!.run.counts.fail).toBe(1)
    expect(summary.find(s => s.slug === setB.slug)).toMatchObject({ required: true, run: { id: runB } })
    const again = await owner.post(`${base()}/versions/${V}/sign-off`, { comment: 'Twice.' })
    expect(again.status).toBe(409)
    expect(again.body.data.code).toBe('already_signed')
  })

  it('is countersigned by a viewer, once; not by qa', async () => {
    expect((await qa.post(`${base()}/versions/${V}/countersign`, { comment: 'Seen.' })).status).toBe(403)
    const res = await viewer.post(`${base()}/versions/${V}/countersign`, { comment: 'Countersigned for the release board.' })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const again = await viewer.post(`${base()}/versions/${V}/countersign`, { comment: 'Again.' })
    expect(again.status).toBe(409)
    expect(again.body.data.code).toBe('already_countersigned')
  })

  it('needs a signature before a countersignature, and a second person for it', async () => {
    const label = V2
    await submitTable(qa, code, label, setA.id, await tableFromSet(qa, setA.id))
    await submitTable(qa, code, label, setB.id, await tableFromSet(qa, setB.id))
    const early = await viewer.post(`${base()}/versions/${label}/countersign`, { comment: 'Too early.' })
    expect(early.status).toBe(409)
    expect(early.body.data.code).toBe('not_signed')
    expect((await admin.post(`${base()}/versions/${label}/sign-off`, { comment: 'Signed by the administrator.' })).status).toBe(201)
    const self = await admin.post(`${base()}/versions/${label}/countersign`, { comment: 'And countersigned by the same.' })
    expect(self.status).toBe(403)
    expect(self.body.data.code).toBe('two_person_rule')
    expect(self.body.message).toMatch(/second person/)
  })

  it('is superseded, not changed, by a later run on the version; then it can be signed again', async () => {
    const later = await submitTable(qa, code, V, setA.id, await tableFromSet(qa, setA.id))
    const rows = await sql<{ id: number, kind: string, superseded_by_run_id: number | null, comment: string }>('SELECT id, kind, superseded_by_run_id, comment FROM sign_offs WHERE version_id = (SELECT v.id FROM versions v JOIN codes c ON c.id = v.code_id WHERE c.slug = ? AND v.label = ?) ORDER BY id', [code, V])
    expect(rows.map(x => [x.kind, x.superseded_by_run_id])).toEqual([['sign', later], ['countersign', later]])
    expect(rows[0]!.comment).toBe('Reviewed: one known failure in set A.')
    const audit = await sql<{ n: number }>('SELECT COUNT(*) AS n FROM audit_log WHERE action = \'supersede-sign-off\' AND object_id IN (?, ?)', [String(rows[0]!.id), String(rows[1]!.id)])
    expect(Number(audit[0]!.n)).toBe(2)
    const record = (await viewer.get(`${base()}/versions/${V}/record`)).body.record
    expect(record.signOffs.map((s: { supersededByRunId: number | null }) => s.supersededByRunId)).toEqual([later, later])
    const res = await owner.post(`${base()}/versions/${V}/sign-off`, { comment: 'Re-signed over the new run.' })
    expect(res.status).toBe(201)
    const [fresh] = await sql<{ run_ids: string }>('SELECT run_ids FROM sign_offs WHERE id = ?', [res.body.signOff.id])
    expect(json(fresh!.run_ids).sort()).toEqual([later, runB].sort())
  })

  it('is append-only in the database: no other change, no second supersession, no deletion', async () => {
    await expect(sql('UPDATE sign_offs SET comment = \'edited\' WHERE id = ?', [signatureId])).rejects.toThrow(/append-only/)
    await expect(sql('UPDATE sign_offs SET superseded_by_run_id = superseded_by_run_id + 1 WHERE id = ?', [signatureId])).rejects.toThrow(/append-only/)
    await expect(sql('DELETE FROM sign_offs WHERE id = ?', [signatureId])).rejects.toThrow(/append-only/)
  })
})

describe('the verification record', () => {
  const label = V3
  let deviationId = 0
  let runA = 0
  beforeAll(async () => {
    runA = await submitTable(qa, code, label, setA.id, await tableFromSet(qa, setA.id, i => (i.n === '8' && (i.x === '0.5' || i.x === '1') ? 'off' : null)))
    deviationId = (await owner.post('/api/deviations', { code, set: setA.slug, scope: 'case', inputs: { n: '8', x: '1' }, reason: 'Known cancellation at n = 8; tracked for the next release.', expiresAtVersion: '999.0.0' })).body.deviation.id
    expect((await qa.post(`/api/deviations/${deviationId}/approve`, { comment: 'Accepted until 999.0.0.' })).status).toBe(200)
  })

  it('shows the version, each set as fixed, results per region, failures, deviations, signatures and the caution', async () => {
    const res = await viewer.get(`${base()}/versions/${label}/record`)
    expect(res.status).toBe(200)
    const r = res.body.record
    expect(r.version.label).toBe(label)
    expect(r.requiredSets).toEqual([setA.slug, setB.slug].sort())
    expect(r.missingRequired).toEqual([setB.slug])
    const a = r.sets.find((s: { slug: string }) => s.slug === setA.slug)
    expect(a.reference).toMatchObject({ revision: 1, targetDigits: 20, source: 'Plumbline engine; spot values checked against A&S Table 22.12' })
    expect(a.reference.criterion.tolerance).toEqual({ kind: 'ulps', maxUlps: '4' })
    expect(a.run.id).toBe(runA)
    expect(a.run.summary.counts).toMatchObject({ fail: 1, accepted: 1 })
    expect(a.run.regions.all.counts).toMatchObject({ fail: 1, accepted: 1 })
    expect(a.failures).toEqual([expect.objectContaining({ inputs: { n: '8', x: '0.5' }, verdict: 'fail' })])
    expect(a.failureCount).toBe(1)
    expect(r.sets.find((s: { slug: string }) => s.slug === setB.slug)).toMatchObject({ required: true, run: null })
    expect(r.deviations).toEqual([expect.objectContaining({ id: deviationId, state: 'approved', forThisVersion: 'applies', decidedBy: expect.objectContaining({ email: 'qa@corrie-point.test' }) })])
    expect(r.caution).toMatch(/does not replace an organisation's QA programme/)
    expect(r.caution).toMatch(/local codes and licensed review/)
    expect((await viewer.get(`${base()}/versions/9.9.9/record`)).status).toBe(404)
  })

  it('exports JSON with every case', async () => {
    const res = await viewer.get(`${base()}/versions/${label}/record/export?format=json`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-disposition')).toContain(`verification-record-${code}-${label}.json`)
    expect(res.body.cases[setA.slug]).toHaveLength(setA.caseCount)
    expect(res.body.cases[setA.slug].filter((c: { verdict: string }) => c.verdict === 'accepted')).toEqual([expect.objectContaining({ acceptedBy: deviationId, storedVerdict: 'fail' })])
    expect((await viewer.get(`${base()}/versions/${label}/record/export?format=pdf`)).body.data.issues[0].field).toBe('format')
  })

  it('exports CSV, one row per case, with the caution and the deviation that accepted a case', async () => {
    const res = await viewer.get(`${base()}/versions/${label}/record/export?format=csv`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/text\/csv/)
    const lines = (res.body as string).trim().split('\n')
    expect(lines[1]).toMatch(/^# A verdict from Plumbline is evidence/)
    const head = lines[2]!.split(',')
    expect(head.slice(0, 5)).toEqual(['set', 'set_revision', 'run_id', 'line', 'inputs'])
    const rows = lines.slice(3)
    expect(rows.filter(l => l.startsWith(`${setA.slug},`))).toHaveLength(setA.caseCount)
    expect(rows.filter(l => l.startsWith(`${setB.slug},`))).toEqual([expect.stringContaining('not_run')])
    // inputs are written `n=8; x=1`, so no cell here needs quoting
    const accepted = rows.find(l => l.includes(',accepted,'))!.split(',')
    expect(accepted[head.indexOf('stored_verdict')]).toBe('fail')
    expect(accepted[head.indexOf('accepted_by_deviation')]).toBe(String(deviationId))
  })

  it('exports JUnit XML that parses: one test case per case, failures as <failure>, accepted ones noted', async () => {
    const res = await viewer.get(`${base()}/versions/${label}/record/export?format=junit`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/application\/xml/)
    const xml = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: name => ['testsuite', 'testcase', 'property'].includes(name) }).parse(res.body as string)
    const suites = xml.testsuites.testsuite as Array<{ name: string, tests: string, failures: string, properties: { property: Array<{ name: string, value: string }> }, testcase: Array<Record<string, unknown>> }>
    expect(suites).toHaveLength(2)
    const a = suites.find(s => s.name.includes(setA.slug))!
    expect(a.testcase).toHaveLength(setA.caseCount)
    expect(Number(a.tests)).toBe(setA.caseCount)
    expect(Number(a.failures)).toBe(1)
    const failed = a.testcase.filter(t => t.failure)
    expect(failed).toHaveLength(1)
    expect(failed[0]).toMatchObject({ name: 'n=8, x=0.5', failure: { type: 'fail' } })
    const accepted = a.testcase.find(t => t.name === 'n=8, x=1')!
    expect(accepted.failure).toBeUndefined()
    expect(String(accepted['system-out'])).toMatch(new RegExp(`accepted by deviation ${deviationId}: judged fail`))
    const props = Object.fromEntries(a.properties.property.map(p => [p.name, p.value]))
    expect(props).toMatchObject({ code, version: label, reference_set: setA.slug, certified_digits: '20' })
    expect(props.caution).toMatch(/does not replace/)
    const b = suites.find(s => s.name.includes(setB.slug))!
    expect(b.testcase[0]).toMatchObject({ name: 'run on this version', failure: { type: 'not_run' } })
    expect(Number(xml.testsuites.tests)).toBe(setA.caseCount + 1)
  })
})
