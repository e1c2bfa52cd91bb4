// A version is one build: later submissions for it may repeat, leave out or
// add to its commit and environment, never change them (shared/domain/build.ts).
// Against the real server and MariaDB.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'
import { dbQuery } from '../support/db'
import { LARGE_TABLE_BYTES } from '../../server/utils/large-table-turn'

const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
/** An honest binary64 table for hermiteSet()'s grid; `salt` changes the file, not the values. */
const table = (salt: string) => [`# ${salt}`, 'n,x,H', ...NS.flatMap(n => XS.map(x => `${n},${x},${hermiteDouble(n, Number(x)).toPrecision(17)}`))].join('\n') + '\n'

let qa: Client
let setA: { id: number }
let setB: { id: number }

const env = { compiler: 'gfortran 13.2', floatFormat: 'binary64', libraries: { openblas: '0.3.26' } }

async function send(version: string, set: { id: number }, extra: Record<string, string> = {}) {
  return upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id), ...extra }, { name: `${version}.csv`, content: table(unique('salt')) })
}

async function versionRow(label: string) {
  const [v] = await dbQuery<{ id: number, commit_id: string, environment: string | object }>(
    'SELECT v.id, v.commit_id, v.environment FROM versions v JOIN codes c ON c.id = v.code_id WHERE c.slug = ? AND v.label = ?', ['oscillite', label])
  return { ...v!, environment: typeof v!.environment === 'string' ? JSON.parse(v!.environment) : v!.environment }
}

const runCount = async (versionId: number) =>
  Number((await dbQuery<{ n: number }>('SELECT COUNT(*) AS n FROM runs WHERE version_id = ?', [versionId]))[0]!.n)

beforeAll(async () => {
  qa = await signedIn('qa')
  setA = await readySet(qa, hermiteSet(unique('h-build-a')))
  setB = await readySet(qa, hermiteSet(unique('h-build-b')))
})

describe('build details of an existing version', () => {
  it('accepts a submission that repeats them or leaves them out', async () => {
    const label = unique('build-same')
    expect((await send(label, setA, { commit: 'a1b2c3', environment: JSON.stringify(env) })).status).toBe(201)
    expect((await send(label, setB, { commit: 'a1b2c3', environment: JSON.stringify(env) })).status).toBe(201)
    expect((await send(label, setB)).status).toBe(201)
    const v = await versionRow(label)
    expect(v.commit_id).toBe('a1b2c3')
    expect(v.environment).toEqual(env)
    expect(await runCount(v.id)).toBe(3)
  })

  it('refuses with 409 a commit or field that contradicts the version, naming each, and stores nothing', async () => {
    const label = unique('build-diff')
    expect((await send(label, setA, { commit: 'a1b2c3', environment: JSON.stringify(env) })).status).toBe(201)
    const v = await versionRow(label)

    const r = await send(label, setB, { commit: 'ffff00', environment: JSON.stringify({ compiler: 'gfortran 14.1', libraries: { openblas: '0.3.27' } }) })
    expect(r.status).toBe(409)
    expect(r.body.data.code).toBe('build_differs')
    expect(r.body.data.issues.map((i: { field: string }) => i.field)).toEqual(['commit', 'environment.compiler', 'environment.libraries.openblas'])
    expect(r.body.message).toContain(`Version ${label} was recorded with compiler "gfortran 13.2"; this submission says "gfortran 14.1".`)
    expect(r.body.message).toContain('label of its own')

    expect(await runCount(v.id)).toBe(1)
    expect(await versionRow(label)).toEqual(v)
  })

  it('fills in what the version did not record, in the run\'s transaction, with an audit entry', async () => {
    const label = unique('build-fill')
    expect((await send(label, setA)).status).toBe(201)
    const before = await versionRow(label)
    expect(before.commit_id).toBe('')
    expect(before.environment).toEqual({})

    const r = await send(label, setB, { commit: 'beef01', environment: JSON.stringify({ platform: 'x86_64-linux', floatFormat: 'binary64' }) })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const after = await versionRow(label)
    expect(after.commit_id).toBe('beef01')
    expect(after.environment).toEqual({ platform: 'x86_64-linux', floatFormat: 'binary64' })
    const audit = await dbQuery<{ action: string, actor: string }>('SELECT action, actor FROM audit_log WHERE object_type = ? AND object_id = ? ORDER BY id', ['version', String(after.id)])
    expect(audit.map(a => a.action)).toEqual(['create-version', 'complete-version-build'])

    // once recorded, the filled field holds like any other
    const again = await send(label, setA, { environment: JSON.stringify({ platform: 'aarch64-linux' }) })
    expect(again.status).toBe(409)
    expect(again.body.data.issues[0].field).toBe('environment.platform')
  })

  it('does not fill anything from a table that is refused', async () => {
    const label = unique('build-refused')
    expect((await send(label, setA)).status).toBe(201)
    const bad = await upload(qa, '/api/runs', { code: 'oscillite', version: label, setId: String(setB.id), commit: 'cafe42' }, { name: 'bad.csv', content: table('bad').replace('\n4,0.5,', '\n4,0.5,1.2.3x') })
    expect(bad.status).toBe(400)
    expect(bad.body.data.code).toBe('unreadable_rows')
    expect((await versionRow(label)).commit_id).toBe('')
  })
})

describe('a new version from two pipelines at once', () => {
  it('makes one version, and stores both runs', async () => {
    const label = unique('build-race')
    const both = await Promise.all([
      send(label, setA, { commit: 'a1b2c3', environment: JSON.stringify(env) }),
      send(label, setB, { commit: 'a1b2c3', environment: JSON.stringify(env) }),
    ])
    expect(both.map(r => r.status), JSON.stringify(both.map(r => r.body))).toEqual([201, 201])
    const v = await versionRow(label)
    expect(await runCount(v.id)).toBe(2)
    const audit = await dbQuery<{ action: string }>('SELECT action FROM audit_log WHERE object_type = ? AND object_id = ?', ['version', String(v.id)])
    expect(audit.map(a => a.action)).toEqual(['create-version'])
  })

  it('stores the same file sent twice at once as one run, and answers the second as a repeat', async () => {
    const label = unique('build-race-same')
    const content = table(unique('same'))
    const post = () => upload(qa, '/api/runs', { code: 'oscillite', version: label, setId: String(setA.id) }, { name: 'same.csv', content })
    const both = await Promise.all([post(), post()])
    expect(both.map(r => r.status).sort(), JSON.stringify(both.map(r => r.body))).toEqual([200, 201])
    expect(both[0]!.body.run.id).toBe(both[1]!.body.run.id)
    expect(both.map(r => r.body.duplicate).sort()).toEqual([false, true])
    expect(await runCount((await versionRow(label)).id)).toBe(1)
  })

  it('refuses the second when the two name different builds', async () => {
    const label = unique('build-race-diff')
    const both = await Promise.all([
      send(label, setA, { commit: 'a1b2c3' }),
      send(label, setB, { commit: 'ffff00' }),
    ])
    expect(both.map(r => r.status).sort(), JSON.stringify(both.map(r => r.body))).toEqual([201, 409])
    const v = await versionRow(label)
    expect(await runCount(v.id)).toBe(1)
  })
})

describe('large tables at once', () => {
  it('judges two large tables sent together, taking turns, and stores both', async () => {
    // over LARGE_TABLE_BYTES (server/utils/large-table-turn.ts) through a long log header
    const log = Array.from({ length: 60_000 }, (_, i) => `# iteration ${i}: residual below tolerance`).join('\n')
    const big = (salt: string) => `${log}\n${table(salt)}`
    expect(big('x').length).toBeGreaterThan(LARGE_TABLE_BYTES)
    const label = unique('build-large')
    const post = (set: { id: number }) => upload(qa, '/api/runs', { code: 'oscillite', version: label, setId: String(set.id) }, { name: 'big.csv', content: big(unique('big')) })
    const both = await Promise.all([post(setA), post(setB)])
    expect(both.map(r => r.status), JSON.stringify(both.map(r => r.body))).toEqual([201, 201])
    expect(both.map(r => r.body.run.counts.pass)).toEqual([20, 20])
    expect(await runCount((await versionRow(label)).id)).toBe(2)
  })
})
