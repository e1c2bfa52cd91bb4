// Reference sets and submissions against the real server and MariaDB:
// computing a set, freezing and revising it, downloads, and judging uploaded
// tables (formats, verdict kinds, refusal, 413, deduplication, atomicity).
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, reviseSet, upload } from '../support/sets'
import { dbQuery } from '../support/db'

let qa: Client
let viewer: Client
let set: { id: number, slug: string, caseCount: number, revision: number }

// The grid of hermiteSet(): n ∈ {0,4,8,12} × x ∈ {-1,-0.5,0,0.5,1}.
const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']

function table(value: (n: number, x: string) => string, rows = NS.flatMap(n => XS.map(x => [n, x] as const))) {
  return ['n,x,H', ...rows.map(([n, x]) => `${n},${x},${value(n, x)}`)].join('\n') + '\n'
}
const honest = (n: number, x: string) => hermiteDouble(n, Number(x)).toPrecision(17)

async function dbCount(query: string, args: unknown[]) {
  const [row] = await dbQuery<{ n: number }>(query, args)
  return Number(row!.n)
}

beforeAll(async () => {
  qa = await signedIn('qa')
  viewer = await signedIn('viewer')
  set = await readySet(qa, hermiteSet(unique('h-small')))
})

describe('reference sets', () => {
  it('computes every case with certified digits, in grid order', async () => {
    expect(set.caseCount).toBe(20)
    const page = await viewer.get(`/api/reference-sets/${set.id}/cases?pageSize=10&page=1`)
    expect(page.body.total).toBe(20)
    // H_4(-1) = 16 - 48 + 12 = -20 (A&S 22.12: H_4 = 16x^4 - 48x^2 + 12)
    const h4 = (await viewer.get(`/api/reference-sets/${set.id}/cases?pageSize=5&page=2`)).body.rows[0]
    expect(h4.inputs).toEqual({ n: '4', x: '-1' })
    expect(Number(h4.value)).toBe(-20)
    expect(h4.digits).toBeGreaterThanOrEqual(20)
  })

  it('previews a definition without storing it and names bad fields', async () => {
    const p = await qa.post('/api/reference-sets/preview', hermiteSet('preview-only'))
    expect(p.status).toBe(200)
    expect(p.body.caseCount).toBe(20)
    expect(p.body.cases[0].inputs).toEqual({ n: '0', x: '-1' })
    expect(p.body.cases[0].value).toBe('1.0000000000000000000e+0')
    const bad = await qa.post('/api/reference-sets/preview', hermiteSet('bad', { targetDigits: 3 }))
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues.map((i: { field: string }) => i.field)).toContain('targetDigits')
    const domain = await qa.post('/api/reference-sets/preview', hermiteSet('bad2', { grid: { parts: [{ kind: 'points', points: [{ n: '2.5', x: '1' }] }] } }))
    expect(domain.status).toBe(400)
    expect(domain.body.message).toMatch(/n/)
  })

  it('refuses a second set with the same slug', async () => {
    const again = await qa.post('/api/reference-sets', hermiteSet(set.slug))
    expect(again.status).toBe(409)
    expect(again.body.data.issues[0].field).toBe('slug')
  })

  it('downloads values as CSV and JSON at fewer digits, rounded correctly', async () => {
    const csv = await viewer.get(`/api/reference-sets/${set.id}/values?format=csv&digits=5`)
    expect(csv.status).toBe(200)
    const lines = (csv.body as string).trim().split('\n')
    expect(lines[0]).toBe('n,x,value,digits,kappa,region')
    expect(lines).toHaveLength(21)
    // H_12(0.5) = 1.6328e6 to 5 digits? checked below against the JSON at full digits
    const full = await viewer.get(`/api/reference-sets/${set.id}/values?format=json`)
    const five = await viewer.get(`/api/reference-sets/${set.id}/values?format=json&digits=5`)
    full.body.cases.forEach((c: { value: string }, i: number) => {
      const rounded = Number(Number(c.value).toPrecision(5))
      expect(Number(five.body.cases[i].value)).toBe(rounded)
    })
    const tooMany = await viewer.get(`/api/reference-sets/${set.id}/values?digits=500`)
    expect(tooMany.status).toBe(400)
    expect(tooMany.body.data.issues[0].field).toBe('digits')
  })
})

describe('submissions', () => {
  it('judges an honest binary64 table: most cases pass, and every case has a result', async () => {
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('2.5.0-t'), setId: String(set.id) }, { name: 'h.csv', content: table(honest) })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const run = (await viewer.get(`/api/runs/${r.body.run.id}`)).body.run
    expect(run.summary.total).toBe(20)
    expect(run.summary.counts.pass).toBeGreaterThanOrEqual(18)
    expect(run.set.id).toBe(set.id)
    const page = await viewer.get(`/api/runs/${r.body.run.id}/cases?pageSize=50&sort=ulps&dir=desc`)
    expect(page.body.total).toBe(20)
    expect(page.body.rows[0].reference).not.toBeNull()
    // the set is frozen once a run used it
    expect((await viewer.get(`/api/reference-sets/${set.id}`)).body.set.frozenAt).not.toBeNull()
  })

  it('gives missing, unexpected, duplicate and non-finite cases verdicts of their own', async () => {
    const rows = NS.flatMap(n => XS.map(x => [n, x] as const)).filter(([n, x]) => !(n === 8 && x === '0'))
    let body = table((n, x) => (n === 12 && x === '1' ? 'NaN' : honest(n, x)), rows)
    body += '4,0.5,-5\n' // a second row for H_4(0.5); the first one is judged
    body += '3,0.25,1.0\n' // not a case of the set
    body += '0,-0.50,1\n' // -0.50 is the case x = -0.5 again, spelled differently
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('2.5.1-t'), setId: String(set.id) }, { name: 'gaps.csv', content: body })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    expect(r.body.run.counts).toMatchObject({ missing: 1, unexpected: 1, duplicate: 2, non_finite: 1 })
    const dup = await viewer.get(`/api/runs/${r.body.run.id}/cases?verdict=duplicate`)
    expect(dup.body.rows.map((x: { decidedBy: string }) => x.decidedBy).every((d: string) => /repeats line/.test(d))).toBe(true)
    // a row that matches no case keeps its own inputs, by exact value
    const extra = await viewer.get(`/api/runs/${r.body.run.id}/cases?verdict=unexpected`)
    expect(extra.body.rows).toHaveLength(1)
    expect(extra.body.rows[0]).toMatchObject({ inputs: { n: '3', x: '0.25' }, measured: '1.0', decidedBy: 'no-case' })
  })

  it('marks a value that is far off as a failure with its error figures', async () => {
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('2.6.0-t'), setId: String(set.id) }, { name: 'off.csv', content: table((n, x) => (n === 8 && x === '0.5' ? (hermiteDouble(8, 0.5) * (1 + 1e-9)).toPrecision(17) : honest(n, x))) })
    expect(r.status).toBe(201)
    const fails = await viewer.get(`/api/runs/${r.body.run.id}/cases?verdict=fail`)
    expect(fails.body.rows).toHaveLength(1)
    expect(fails.body.rows[0].inputs).toEqual({ n: '8', x: '0.5' })
    expect(Number(fails.body.rows[0].relError)).toBeCloseTo(1e-9, 12)
    expect(Number(fails.body.rows[0].ulps)).toBeGreaterThan(1000)
  })

  it('reads Fortran D exponents, hex floats and whitespace columns the same way', async () => {
    const fortran = ['# n  x  H', ...NS.flatMap(n => XS.map(x => `  ${n}  ${x}  ${hermiteDouble(n, Number(x)).toExponential(16).replace('e', 'D')}`))].join('\n')
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('f-t'), setId: String(set.id), mapping: JSON.stringify({ n: 'n', x: 'x', value: 'H' }) }, { name: 'fort.txt', content: fortran })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    expect(r.body.run.counts.pass).toBeGreaterThanOrEqual(18)
  })

  it('refuses a table with unreadable rows whole, naming line and column, and stores nothing', async () => {
    const version = unique('bad-t')
    const body = table(honest).replace('\n4,0.5,', '\n4,0.5,1.2.3x').replace('\n8,1,', '\n8,1,abc')
    const before = await dbCount('SELECT COUNT(*) AS n FROM runs', [])
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: 'bad.csv', content: body })
    expect(r.status).toBe(400)
    expect(r.body.data.code).toBe('unreadable_rows')
    expect(r.body.data.errors[0]).toMatchObject({ line: expect.any(Number), column: expect.any(Number) })
    expect(r.body.data.errorCount).toBeGreaterThanOrEqual(2)
    expect(await dbCount('SELECT COUNT(*) AS n FROM runs', [])).toBe(before)
    expect(await dbCount('SELECT COUNT(*) AS n FROM versions WHERE label = ?', [version])).toBe(0)
  })

  it('refuses a table over 50 MB with 413', async () => {
    const big = new Uint8Array(50 * 1024 * 1024 + 10).fill(0x31)
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('big-t'), setId: String(set.id) }, { name: 'big.csv', content: big })
    expect(r.status).toBe(413)
  })

  it('refuses a multipart body without a boundary, or without the file, with 400 and stores nothing', async () => {
    const before = await dbCount('SELECT COUNT(*) AS n FROM runs', [])
    const noBoundary = await fetch(`${qa.base}/api/runs`, { method: 'POST', body: 'code=oscillite', headers: { 'content-type': 'multipart/form-data', origin: qa.base, cookie: qa.cookie } })
    expect(noBoundary.status).toBe(400)
    expect((await noBoundary.json()).data.code).toBe('invalid_input')
    const form = new FormData()
    form.append('code', 'oscillite')
    form.append('version', unique('nofile'))
    form.append('setId', String(set.id))
    form.append('table', new Blob([table(honest)]), 'wrong-field.csv')
    const noFile = await fetch(`${qa.base}/api/runs`, { method: 'POST', body: form, headers: { origin: qa.base, cookie: qa.cookie } })
    expect(noFile.status).toBe(400)
    expect((await noFile.json()).data.issues).toEqual([{ field: 'file', message: 'Attach the output table.' }])
    expect(await dbCount('SELECT COUNT(*) AS n FROM runs', [])).toBe(before)
  })

  it('recognises the same file for the same version and set, and stores it once', async () => {
    const version = unique('dup-t')
    const content = table(honest)
    const first = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: 'a.csv', content })
    const second = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: 'b.csv', content })
    expect(first.status).toBe(201)
    expect(second.status).toBe(200)
    expect(second.body).toMatchObject({ duplicate: true, run: { id: first.body.run.id } })
  })

  it('keeps runs on the revision they were judged against when the set is revised', async () => {
    const local = await readySet(qa, hermiteSet(unique('h-rev')))
    const r = await upload(qa, '/api/runs', { code: 'quadrat', version: unique('rev-t'), setId: String(local.id) }, { name: 'h.csv', content: table(honest) })
    expect(r.status).toBe(201)
    const revised = await qa.request('PUT', `/api/reference-sets/${local.id}`, hermiteSet(local.slug, { targetDigits: 25 }))
    expect(revised.status, JSON.stringify(revised.body)).toBe(200)
    expect(revised.body.set.revision).toBe(2)
    const run = (await viewer.get(`/api/runs/${r.body.run.id}`)).body.run
    expect(run.set.revision).toBe(1)
    expect(run.state).toBe('stale')
    const renamed = await qa.request('PUT', `/api/reference-sets/${local.id}`, hermiteSet('another-slug'))
    expect(renamed.status).toBe(400)
  })

  it('takes the set by slug for its newest revision, and names the field when the set is given twice, not at all or unknown', async () => {
    const local = await readySet(qa, hermiteSet(unique('h-slug')))
    const newest = await reviseSet(qa, local.id, hermiteSet(local.slug, { targetDigits: 22 }))
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('slug-t'), set: local.slug }, { name: 'h.csv', content: table(honest) })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const run = (await viewer.get(`/api/runs/${r.body.run.id}`)).body.run
    expect(run.set).toMatchObject({ id: newest.id, revision: 2 })

    const send = (fields: Record<string, string>) => upload(qa, '/api/runs', { code: 'oscillite', version: unique('slug-bad'), ...fields }, { name: 'h.csv', content: table(honest) })
    const both = await send({ set: local.slug, setId: String(local.id) })
    expect(both.status).toBe(400)
    expect(both.body.data.issues[0]).toMatchObject({ field: 'set', message: expect.stringMatching(/not both/) })
    const neither = await send({})
    expect(neither.status).toBe(400)
    expect(neither.body.data.issues[0].field).toBe('setId')
    const unknown = await send({ set: unique('no-such-set') })
    expect(unknown.status).toBe(404)
    expect(unknown.body.data.issues[0].field).toBe('set')
  })

  it('previews a table: columns, first rows and a suggested mapping', async () => {
    const r = await upload(qa, '/api/submissions/preview', { setId: String(set.id) }, { name: 'h.csv', content: table(honest) })
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ format: 'csv', columns: ['n', 'x', 'H'], rowCount: 20, mapping: { n: 'n', x: 'x', value: 'H' } })
  })

  it('exports a run as CSV and as JSON, each with the caution', async () => {
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('exp-t'), setId: String(set.id) }, { name: 'h.csv', content: table(honest) })
    expect(r.status).toBe(201)
    const csv = (await viewer.get(`/api/runs/${r.body.run.id}/export?format=csv`)).body as string
    const lines = csv.trim().split('\n')
    expect(lines[0]).toMatch(/^# A verdict is evidence/)
    expect(lines[1]).toBe('line,n,x,region,measured,reference,reference_digits,abs_error,rel_error,ulps,digits_agreed,verdict,decided_by,stored_verdict,accepted_by_deviation')
    expect(lines).toHaveLength(22)
    const json = (await viewer.get(`/api/runs/${r.body.run.id}/export?format=json`)).body
    expect(json.caution).toMatch(/does not replace/)
    expect(json.cases).toHaveLength(20)
  })

  it('draws the error map over n and x', async () => {
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('map-t'), setId: String(set.id) }, { name: 'h.csv', content: table(honest) })
    const map = (await viewer.get(`/api/runs/${r.body.run.id}/map`)).body
    expect(map).toMatchObject({ xParam: 'x', yParam: 'n', metric: 'ulps' })
    expect(map.points).toHaveLength(20)
    const one = await viewer.get(`/api/runs/${r.body.run.id}/cases?caseId=${map.points[3].caseId}`)
    expect(one.body.total).toBe(1)
    expect(one.body.rows[0].id).toBe(map.points[3].caseId)
  })

  it('bins the map of a large run into a grid whose cells show their worst case', async () => {
    // 9 × 1000 = 9,000 cases, past the 8,000 a map draws one by one
    const big = await readySet(qa, hermiteSet(unique('map-big'), { grid: { parts: [{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '8', step: '1' }, { param: 'x', start: '-5', stop: '4.99', step: '0.01' }] }] } }))
    const rows: string[] = ['n,x,H']
    for (let n = 0; n <= 8; n++) {
      for (let i = -500; i < 500; i++) {
        const x = (i / 100).toString()
        // one planted miss, far outside any tolerance
        const v = n === 7 && i === 123 ? hermiteDouble(n, i / 100) * 1.01 : hermiteDouble(n, i / 100)
        rows.push(`${n},${x},${v.toPrecision(17)}`)
      }
    }
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: unique('map-big'), setId: String(big.id), mapping: JSON.stringify({ n: 'n', x: 'x', value: 'H' }) }, { name: 'big.csv', content: rows.join('\n') + '\n' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const map = (await viewer.get(`/api/runs/${r.body.run.id}/map`)).body
    expect(map.binned).toMatchObject({ cases: 9000, rows: 9 })
    expect(map.points.length).toBeLessThanOrEqual(map.binned.columns * map.binned.rows)
    expect(map.points.reduce((s: number, p: { cases: number }) => s + p.cases, 0)).toBe(9000)
    const planted = map.points.filter((p: { verdict: string }) => p.verdict === 'fail').find((p: { caseX: number, caseY: number }) => p.caseX === 1.23 && p.caseY === 7)
    expect(planted, 'the planted miss shows in its cell').toBeDefined()
    const one = await viewer.get(`/api/runs/${r.body.run.id}/cases?caseId=${planted.caseId}`)
    expect(one.body.rows[0]).toMatchObject({ verdict: 'fail' })
  })
})

describe('CI tokens on the submission route', () => {
  const DEMO = 'plb_demo_oscillite_7f3c2a9e51d84b06'
  async function tokenUpload(token: string, code: string) {
    const form = new FormData()
    form.append('code', code)
    form.append('version', unique('ci'))
    form.append('setId', String(set.id))
    form.append('file', new Blob([table(honest)]), 'ci.csv')
    const res = await fetch(`${qa.base}/api/runs`, { method: 'POST', body: form, headers: { authorization: `Bearer ${token}` } })
    return { status: res.status, body: await res.json() }
  }
  it('accepts the demo token for its own code', async () => {
    expect((await tokenUpload(DEMO, 'oscillite')).status).toBe(201)
  })
  it('refuses it for another code with 403 and an unknown token with 401', async () => {
    expect((await tokenUpload(DEMO, 'quadrat')).status).toBe(403)
    expect((await tokenUpload('plb_not_a_token', 'oscillite')).status).toBe(401)
  })
})
