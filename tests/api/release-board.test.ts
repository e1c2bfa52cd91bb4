// Versions, board states and the regression flag against the real server and
// MariaDB. Each describe uses a reference set of its own, so other tests'
// runs on the shared demo codes cannot change what is asserted here.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'
import { dbQuery } from '../support/db'

// The grid of hermiteSet(): n ∈ {0,4,8,12} × x ∈ {-1,-0.5,0,0.5,1}; 20 cases.
const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
const honest = (n: number, x: string) => hermiteDouble(n, Number(x)).toPrecision(17)
/** A table where the listed cases (as "n,x") are off by a relative 1e-6. */
function table(off: string[] = []) {
  const rows = NS.flatMap(n => XS.map(x => `${n},${x},${off.includes(`${n},${x}`) ? (hermiteDouble(n, Number(x)) * (1 + 1e-6) + 1e-6).toPrecision(17) : honest(n, x)}`))
  return ['n,x,H', ...rows].join('\n') + '\n'
}

let qa: Client
let viewer: Client
// a major number no other test uses, so these labels sort among themselves
const major = 100 + Math.floor(Math.random() * 800000)
const label = (minor: number, rest = '.0') => `${major}.${minor}${rest}`

async function submit(set: { id: number }, version: string, off: string[] = [], extra: Record<string, string> = {}) {
  const r = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id), ...extra }, { name: `${version}.csv`, content: table(off) })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body.run.id as number
}

beforeAll(async () => {
  qa = await signedIn('qa')
  viewer = await signedIn('viewer')
})

describe('versions', () => {
  it('orders versions by semantic version, other labels by creation, and keeps the build environment', async () => {
    const set = await readySet(qa, hermiteSet(unique('h-order')))
    const environment = { compiler: 'gfortran 13.2', flags: '-O2 -fno-fast-math', platform: 'x86_64-linux', floatFormat: 'binary64', libraries: { openblas: '0.3.26' } }
    for (const v of [label(10), label(2), `nightly-${major}-b`, label(9, '.3'), `nightly-${major}-a`, label(10, '.0-rc.1')]) {
      await submit(set, v, [], v === label(2) ? { environment: JSON.stringify(environment), commit: 'abc123def456' } : {})
    }
    const code = (await viewer.get('/api/codes/oscillite')).body
    const mine = code.versions.map((v: { label: string }) => v.label).filter((l: string) => l.startsWith(`${major}.`) || l.includes(`-${major}-`))
    expect(mine).toEqual([label(2), label(9, '.3'), label(10, '.0-rc.1'), label(10), `nightly-${major}-b`, `nightly-${major}-a`])
    const v2 = code.versions.find((v: { label: string }) => v.label === label(2))
    expect(v2.environment).toEqual(environment)
    expect(v2.commitId).toBe('abc123def456')
  })

  it('refuses a malformed build environment, naming the field', async () => {
    const set = await readySet(qa, hermiteSet(unique('h-env')))
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: label(77), setId: String(set.id), environment: JSON.stringify({ compiler: 42 }) }, { name: 'e.csv', content: table() })
    expect(r.status).toBe(400)
    expect(r.body.data.issues[0].field).toBe('environment.compiler')
    const bad = await upload(qa, '/api/runs', { code: 'oscillite', version: label(77), setId: String(set.id), environment: JSON.stringify({ floatFormat: 'binary80x' }) }, { name: 'e.csv', content: table() })
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues[0].field).toBe('environment.floatFormat')
  })
})

describe('board states', () => {
  let set: { id: number, slug: string }
  const cellOf = async (version: string, slug = set.slug) => {
    const board = (await viewer.get(`/api/board?code=oscillite&set=${slug}`)).body
    const v = board.codes[0].versions.find((x: { label: string }) => x.label === version)
    return v.cells.find((c: { set: string }) => c.set === slug)
  }

  beforeAll(async () => {
    set = await readySet(qa, hermiteSet(unique('h-board')))
  })

  it('shows passed, failed with its count, and not yet verified', async () => {
    const passRun = await submit(set, label(20))
    const failRun = await submit(set, label(21), ['4,0.5', '8,1', '12,-1'])
    const other = await readySet(qa, hermiteSet(unique('h-board-other')))
    await submit(other, label(23))
    expect(await cellOf(label(20))).toMatchObject({ state: 'passed', runId: passRun, failures: 0 })
    expect(await cellOf(label(21))).toMatchObject({ state: 'failed', runId: failRun, failures: 3 })
    expect(await cellOf(label(23))).toMatchObject({ state: 'unverified', runId: null })
  })

  it('is decided by the latest run of the version', async () => {
    await submit(set, label(24), ['0,0'])
    expect((await cellOf(label(24))).state).toBe('failed')
    const fixed = await submit(set, label(24))
    expect(await cellOf(label(24))).toMatchObject({ state: 'passed', runId: fixed })
  })

  it('shows passed with accepted deviations when the only non-passing cases are accepted', async () => {
    // a run whose counts carry accepted cases, as approved deviations leave them
    const [v] = await dbQuery<{ id: number }>('SELECT id FROM versions WHERE label = ?', [label(20)])
    const [s] = await dbQuery<{ id: number }>('SELECT id FROM reference_sets WHERE slug = ?', [set.slug])
    await dbQuery(`INSERT INTO runs (version_id, set_id, file_name, file_sha256, file_size, column_mapping, counts, regions)
      VALUES (?, ?, 'accepted.csv', SHA2(?, 256), 1, '{}', '{"pass":19,"accepted":1}', '{"overall":{"total":20,"counts":{"pass":19,"accepted":1}},"regions":{}}')`, [v!.id, s!.id, unique('acc')])
    expect((await cellOf(label(20))).state).toBe('accepted')
  })

  it('shows stale when the latest run was judged against an older revision of the set', async () => {
    const staleSet = await readySet(qa, hermiteSet(unique('h-stale')))
    const run = await submit(staleSet, label(30))
    expect((await cellOf(label(30), staleSet.slug)).state).toBe('passed')
    const revised = await qa.request('PUT', `/api/reference-sets/${staleSet.id}`, hermiteSet(staleSet.slug, { notes: 'revised grid notes' }))
    expect(revised.status, JSON.stringify(revised.body)).toBe(200)
    expect(revised.body.set.revision).toBe(2)
    const cell = await cellOf(label(30), staleSet.slug)
    expect(cell).toMatchObject({ state: 'stale', runId: run })
    const board = (await viewer.get(`/api/board?code=oscillite&set=${staleSet.slug}`)).body
    expect(board.sets).toEqual([expect.objectContaining({ slug: staleSet.slug, revision: 2 })])
  })

  it('counts cells by state and lists the owners to filter by', async () => {
    const board = (await viewer.get(`/api/board?code=oscillite&set=${set.slug}`)).body
    const states = board.codes[0].versions.map((v: { cells: { state: string }[] }) => v.cells[0]!.state)
    for (const s of ['passed', 'failed', 'unverified', 'accepted']) expect(board.totals[s]).toBe(states.filter((x: string) => x === s).length)
    expect(board.owners.map((o: { name: string }) => o.name)).toContain('Olu Brennan')
  })

  it('keeps only the newest versions of each code when asked', async () => {
    const board = (await viewer.get('/api/board?code=oscillite&recent=2')).body
    expect(board.codes[0].versions).toHaveLength(2)
    expect(board.codes[0].versionCount).toBeGreaterThan(2)
    const full = (await viewer.get('/api/board?code=oscillite')).body
    expect(full.codes[0].versions.slice(-2).map((v: { id: number }) => v.id)).toEqual(board.codes[0].versions.map((v: { id: number }) => v.id))
  })

  it('pages through codes while the totals count every code', async () => {
    const all = (await viewer.get('/api/board')).body
    const second = (await viewer.get('/api/board?pageSize=1&page=2')).body
    expect(second.codes.map((c: { slug: string }) => c.slug)).toEqual([all.codes[1].slug])
    expect(second.codeTotal).toBe(all.codes.length)
    expect(second.totals).toEqual(all.totals)
    const bad = await viewer.get('/api/board?page=0')
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues[0].field).toBe('page')
  })
})

describe('regression flag', () => {
  let set: { id: number, slug: string }
  const flagOf = async (runId: number) => (await viewer.get(`/api/runs/${runId}`)).body.run.isRegression as boolean

  beforeAll(async () => {
    set = await readySet(qa, hermiteSet(unique('h-regr')))
  })

  it('does not flag the first run on a set', async () => {
    expect(await flagOf(await submit(set, label(40), ['4,0.5']))).toBe(false)
  })

  it('flags a run that fails a case the previous version passed', async () => {
    // 41 fixes 4,0.5 and breaks nothing; 42 breaks 8,1 (same failure count as 40, but a new case)
    expect(await flagOf(await submit(set, label(41)))).toBe(false)
    expect(await flagOf(await submit(set, label(42), ['8,1']))).toBe(true)
  })

  it('does not flag the same failures again, nor a run that fixes cases', async () => {
    expect(await flagOf(await submit(set, label(43), ['8,1']))).toBe(false)
    expect(await flagOf(await submit(set, label(44)))).toBe(false)
  })

  it('compares with the previous version in release order, not in order of submission', async () => {
    // 39 sorts before 40: its predecessor is none, so it is not flagged despite failing
    expect(await flagOf(await submit(set, label(39), ['0,0', '0,1']))).toBe(false)
    // 41 with a second table: previous version is 40 (which failed 4,0.5 only); 0,0 newly fails
    expect(await flagOf(await submit(set, label(41), ['0,0']))).toBe(true)
  })

  it('flags more failures even when per-case results cannot be matched (a revised set)', async () => {
    const revised = await qa.request('PUT', `/api/reference-sets/${set.id}`, hermiteSet(set.slug, { grid: { parts: [{ kind: 'points', points: [{ n: '4', x: '0.5' }, { n: '8', x: '1' }] }] } }))
    expect(revised.status, JSON.stringify(revised.body)).toBe(200)
    let ready = revised.body.set
    for (let i = 0; i < 300 && ready.state !== 'ready'; i++) {
      await new Promise(r => setTimeout(r, 200))
      ready = (await viewer.get(`/api/reference-sets/${ready.id}`)).body.set
    }
    const body = 'n,x,H\n4,0.5,2\n8,1,2\n' // both wrong (H_4(0.5) = 1, H_8(1) = -1648): 2 failures, against 0 for version 44
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version: label(45), setId: String(ready.id) }, { name: 'r2.csv', content: body })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    expect(await flagOf(r.body.run.id)).toBe(true)
    const board = (await viewer.get(`/api/board?code=oscillite&set=${set.slug}`)).body
    const cell = board.codes[0].versions.find((v: { label: string }) => v.label === label(45)).cells[0]
    expect(cell).toMatchObject({ state: 'failed', regression: true, failures: 2 })
  })
})
