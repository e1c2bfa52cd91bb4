// The code page's history (trend, first failing version), comparing two
// versions, and the append-only audit trail, against the real server and MariaDB.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, Client as Anonymous, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'
import { dbQuery } from '../support/db'

// The grid of hermiteSet(): n ∈ {0,4,8,12} × x ∈ {-1,-0.5,0,0.5,1}; 20 cases.
const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
const honest = (n: number, x: string) => hermiteDouble(n, Number(x)).toPrecision(17)
/** Listed cases ("n,x") get a relative error of `rel` (default 1e-6: a failure at 4 ULPs). */
function table(off: Record<string, number> = {}, drop: string[] = []) {
  const rows = NS.flatMap(n => XS.map(x => [n, x] as const)).filter(([n, x]) => !drop.includes(`${n},${x}`))
    .map(([n, x]) => {
      const rel = off[`${n},${x}`]
      return `${n},${x},${rel === undefined ? honest(n, x) : (hermiteDouble(n, Number(x)) * (1 + rel)).toPrecision(17)}`
    })
  return ['n,x,H', ...rows].join('\n') + '\n'
}

let qa: Client
let viewer: Client
const major = 100 + Math.floor(Math.random() * 800000)
const label = (minor: number) => `${major}.${minor}.0`

async function submit(set: { id: number }, version: string, off: Record<string, number> = {}, drop: string[] = []) {
  const r = await upload(qa, '/api/runs', { code: 'quadrat', version, setId: String(set.id) }, { name: `${version}.csv`, content: table(off, drop) })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body.run.id as number
}

beforeAll(async () => {
  qa = await signedIn('qa')
  viewer = await signedIn('viewer')
})

describe('code history and comparison', () => {
  let set: { id: number, slug: string }
  const runs: Record<number, number> = {}

  beforeAll(async () => {
    set = await readySet(qa, hermiteSet(unique('h-hist')))
    // 4,0.5 fails from version 1 on; 8,1 fails in 1, is fixed in 2, fails again from 3; 12,1 fails only in 4
    runs[1] = await submit(set, label(1), { '4,0.5': 1e-6, '8,1': 1e-6 })
    runs[2] = await submit(set, label(2), { '4,0.5': 1e-6 })
    runs[3] = await submit(set, label(3), { '4,0.5': 1e-6, '8,1': 1e-5 })
    runs[4] = await submit(set, label(4), { '4,0.5': 1e-6, '8,1': 1e-5, '12,1': 1e-3 }, ['0,0'])
  })

  it('gives the worst and median error of each version on the set, in release order', async () => {
    const code = (await viewer.get('/api/codes/quadrat')).body
    const series = code.trend.find((s: { slug: string }) => s.slug === set.slug)
    expect(series.points.map((p: { label: string }) => p.label)).toEqual([1, 2, 3, 4].map(label))
    expect(series.points.map((p: { runId: number }) => p.runId)).toEqual([1, 2, 3, 4].map(i => runs[i]))
    // the 1e-3 error of version 4 is its worst case; its median is tiny (most cases are honest)
    const p4 = series.points[3]
    expect(Number(p4.maxRelError)).toBeCloseTo(1e-3, 6)
    expect(Number(p4.medianRelError)).toBeLessThan(1e-12)
    expect(series.points.map((p: { failures: number }) => p.failures)).toEqual([2, 1, 2, 4])
    expect(series.points.map((p: { regression: boolean }) => p.regression)).toEqual([false, false, true, true])
  })

  it('names the first version in which each current failure appeared', async () => {
    // as of version 4: other tests may add newer versions to this code
    const code = (await viewer.get(`/api/codes/quadrat?at=${label(4)}`)).body
    expect(code.failures.version).toBe(label(4))
    const mine = code.failures.sets.find((s: { slug: string }) => s.slug === set.slug)
    expect(mine.total).toBe(4)
    const first = Object.fromEntries(mine.cases.map((c: { inputs: Record<string, string>, firstVersion: string, verdict: string }) => [`${c.inputs.n},${c.inputs.x}`, [c.firstVersion, c.verdict]]))
    expect(first).toEqual({
      '4,0.5': [label(1), 'fail'], // failing since the first version
      '8,1': [label(3), 'fail'], // fixed in 2, so its current spell began in 3
      '12,1': [label(4), 'fail'], // new in 4
      '0,0': [label(4), 'missing'], // left out of the table in 4
    })
    const asOf3 = (await viewer.get(`/api/codes/quadrat?at=${label(3)}`)).body.failures.sets.find((s: { slug: string }) => s.slug === set.slug)
    expect(asOf3.total).toBe(2)
    expect((await viewer.get('/api/codes/quadrat?at=no-such')).status).toBe(404)
  })

  it('compares two versions: newly failing, fixed, the error change with the largest regression first, and a summary line', async () => {
    const r = await viewer.get(`/api/codes/quadrat/compare?from=${label(2)}&to=${label(4)}&set=${set.slug}`)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.from.runId).toBe(runs[2])
    expect(r.body.to.runId).toBe(runs[4])
    expect(r.body.summary).toMatchObject({ compared: 20, newlyFailing: 3, fixed: 0, stillFailing: 1, onlyInTo: 0, onlyInFrom: 0 })
    // the missing case ranks first (no error figure, but it now fails), then 12,1 (1e-3), then 8,1 (1e-5)
    const order = r.body.rows.slice(0, 3).map((x: { inputs: Record<string, string> }) => `${x.inputs.n},${x.inputs.x}`)
    expect(order).toEqual(['0,0', '12,1', '8,1'])
    expect(r.body.rows[1]).toMatchObject({ kind: 'newly-failing', fromVerdict: 'pass', toVerdict: 'fail' })
    expect(r.body.rows[1].change).toBeCloseTo(1e-3, 6)
    expect(r.body.summary.line).toBe(`Quadrat ${label(4)} against ${label(2)} on Test set ${set.slug}: 3 newly failing, 0 fixed, 1 still failing; worst relative error ${Number(r.body.summary.fromMaxRelError).toExponential(1)} → 1.0e-3.`)
  })

  it('lists fixed cases, sorts either way and pages on the server', async () => {
    const fixed = await viewer.get(`/api/codes/quadrat/compare?from=${label(1)}&to=${label(2)}&set=${set.slug}&kind=fixed`)
    expect(fixed.body.total).toBe(1)
    expect(fixed.body.rows[0]).toMatchObject({ kind: 'fixed', inputs: { n: '8', x: '1' }, fromVerdict: 'fail', toVerdict: 'pass' })
    const page1 = await viewer.get(`/api/codes/quadrat/compare?from=${label(1)}&to=${label(4)}&set=${set.slug}&sort=to&dir=asc&pageSize=7&page=1`)
    const page3 = await viewer.get(`/api/codes/quadrat/compare?from=${label(1)}&to=${label(4)}&set=${set.slug}&sort=to&dir=asc&pageSize=7&page=3`)
    expect(page1.body.total).toBe(20)
    expect(page1.body.rows).toHaveLength(7)
    expect(page3.body.rows).toHaveLength(6)
    const keys = [...page1.body.rows, ...page3.body.rows].map((x: { toRelError: string | null }) => x.toRelError).filter((x: string | null) => x !== null).map(Number)
    expect(keys.slice(0, 7)).toEqual([...keys.slice(0, 7)].sort((a, b) => a - b))
    // a case without an error figure (the missing one) sorts last either way
    expect(page3.body.rows.at(-1).toVerdict).toBe('missing')
  })

  it('refuses unknown versions, a version without a run on the set, and bad sorting, naming the field', async () => {
    const none = await viewer.get(`/api/codes/quadrat/compare?from=no-such&to=${label(2)}&set=${set.slug}`)
    expect(none.status).toBe(404)
    expect(none.body.data.issues[0].field).toBe('from')
    const noRun = await viewer.get(`/api/codes/quadrat/compare?from=${label(1)}&to=1.0.0&set=${set.slug}`)
    expect(noRun.status).toBe(404)
    expect(noRun.body.data.code).toBe('no_run')
    expect(noRun.body.data.issues[0].field).toBe('to')
    const bad = await viewer.get(`/api/codes/quadrat/compare?from=${label(1)}&to=${label(2)}&set=${set.slug}&sort=sideways`)
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues[0].field).toBe('sort')
  })
})

describe('audit trail', () => {
  it('lists changes newest first with time, user, action and object, filtered by object', async () => {
    const admin = await signedIn('admin')
    const set = await readySet(qa, hermiteSet(unique('h-audit')))
    const runId = await submit(set, label(90))
    const all = await admin.get('/api/audit?pageSize=5')
    expect(all.status).toBe(200)
    expect(all.body.rows).toHaveLength(5)
    const ids = all.body.rows.map((r: { id: number }) => r.id)
    expect(ids).toEqual([...ids].sort((a, b) => b - a))
    expect(all.body.objectTypes).toContain('run')
    const forRun = await viewer.get(`/api/audit?objectType=run&objectId=${runId}`)
    expect(forRun.body.total).toBe(1)
    expect(forRun.body.rows[0]).toMatchObject({ action: 'submit-run', objectType: 'run', objectId: String(runId), actor: 'qa@corrie-point.test', userName: 'Quentin Sorrel' })
    expect(Date.parse(forRun.body.rows[0].at)).not.toBeNaN()
    const runs = await viewer.get('/api/audit?objectType=run&pageSize=3&page=2')
    expect(runs.body.rows.every((r: { objectType: string }) => r.objectType === 'run')).toBe(true)
    expect(runs.body.page).toBe(2)
    const idOnly = await viewer.get('/api/audit?objectId=5')
    expect(idOnly.status).toBe(400)
    expect(idOnly.body.data.issues[0].field).toBe('objectType')
  })

  it('has no route that changes or removes an entry', async () => {
    const admin = await signedIn('admin')
    const [entry] = await dbQuery<{ id: number }>('SELECT id FROM audit_log ORDER BY id LIMIT 1')
    for (const method of ['PUT', 'PATCH', 'DELETE']) {
      for (const path of ['/api/audit', `/api/audit/${entry!.id}`]) {
        const res = await admin.request(method, path, method === 'DELETE' ? undefined : { action: 'tampered' })
        expect([404, 405], `${method} ${path} gave ${res.status}`).toContain(res.status)
      }
    }
    // anonymous callers are refused before any of that
    expect((await new Anonymous().request('DELETE', '/api/audit')).status).toBe(401)
  })

  it('is refused by the database itself: UPDATE and DELETE fail, the entry stays as it was', async () => {
    const [before] = await dbQuery<{ id: number, action: string }>('SELECT id, action FROM audit_log ORDER BY id LIMIT 1')
    await expect(dbQuery('UPDATE audit_log SET action = ? WHERE id = ?', ['tampered', before!.id])).rejects.toThrow(/append-only/)
    await expect(dbQuery('DELETE FROM audit_log WHERE id = ?', [before!.id])).rejects.toThrow(/append-only/)
    const [after] = await dbQuery<{ id: number, action: string }>('SELECT id, action FROM audit_log WHERE id = ?', [before!.id])
    expect(after).toEqual(before)
  })
})
