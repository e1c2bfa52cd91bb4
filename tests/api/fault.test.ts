// Fault test: a server killed (SIGKILL) while it judges and stores a large
// submission leaves the database with the whole run or none of it.
// A second server process is started on its own port so the shared test server keeps running.
import { spawn, type ChildProcess } from 'node:child_process'
import { join } from 'node:path'
import { createConnection } from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client, demoUser, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet } from '../support/sets'

const PORT = 3199
const URL_ = `http://127.0.0.1:${PORT}`
const root = join(import.meta.dirname, '../..')
let setId = 0
let csv = ''
let rows = 0
let child: ChildProcess | null = null

async function startServer() {
  child = spawn('node', [join(root, '.output/server/index.mjs')], {
    env: { ...process.env, PORT: String(PORT), HOST: '127.0.0.1', NUXT_SESSION_PASSWORD: 'plumbline-fault-test-session-password-0123' },
    stdio: 'ignore',
  })
  for (let i = 0; i < 100; i++) {
    if (await fetch(`${URL_}/api/health`).then(r => r.ok).catch(() => false)) return
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('the second server did not start')
}

async function db<T>(sql: string, args: unknown[]): Promise<T[]> {
  const conn = await createConnection(process.env.NUXT_DATABASE_URL!)
  try {
    return (await conn.query(sql, args))[0] as T[]
  }
  finally {
    await conn.end()
  }
}

async function submit(version: string) {
  const c = new Client()
  c.base = URL_
  const u = demoUser('qa')
  const res = await fetch(`${URL_}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': URL_ }, body: JSON.stringify({ email: u.email, password: u.password }) })
  const cookie = res.headers.getSetCookie().find(h => h.startsWith('plumbline-session='))!.split(';')[0]!
  const form = new FormData()
  form.append('code', 'modeforge')
  form.append('version', version)
  form.append('setId', String(setId))
  form.append('file', new Blob([csv]), 'big.csv')
  return fetch(`${URL_}/api/runs`, { method: 'POST', body: form, headers: { cookie, origin: URL_ } })
}

async function stored(version: string) {
  const runs = await db<{ id: number }>('SELECT r.id FROM runs r JOIN versions v ON v.id = r.version_id WHERE v.label = ?', [version])
  const versions = await db<{ n: number }>('SELECT COUNT(*) AS n FROM versions WHERE label = ?', [version])
  if (!runs.length) return { runs: 0, versions: Number(versions[0]!.n), results: 0, files: 0 }
  const [results] = await db<{ n: number }>('SELECT COUNT(*) AS n FROM case_results WHERE run_id = ?', [runs[0]!.id])
  const [files] = await db<{ n: number }>('SELECT COUNT(*) AS n FROM run_files WHERE run_id = ?', [runs[0]!.id])
  return { runs: runs.length, versions: Number(versions[0]!.n), results: Number(results!.n), files: Number(files!.n) }
}

beforeAll(async () => {
  const qa = await signedIn('qa')
  const set = await readySet(qa, hermiteSet(unique('fault'), {
    grid: { parts: [{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '99', step: '1' }, { param: 'x', start: '-5', stop: '5', step: '0.05' }] }] },
  }))
  setId = set.id
  rows = set.caseCount
  const lines = ['n,x,H']
  for (let n = 0; n < 100; n++) for (let i = -100; i <= 100; i++) lines.push(`${n},${(i / 20).toString()},${hermiteDouble(n, i / 20).toPrecision(17)}`)
  csv = lines.join('\n') + '\n'
}, 300_000)

afterAll(() => {
  child?.kill('SIGKILL')
})

describe('a server killed during a large submission', () => {
  it('stores the whole run when left alone', async () => {
    await startServer()
    const version = unique('whole')
    const res = await submit(version)
    expect(res.status).toBe(201)
    expect(await stored(version)).toEqual({ runs: 1, versions: 1, results: rows, files: 1 })
    child!.kill('SIGKILL')
  }, 120_000)

  it.each([150, 400, 800, 1500])('leaves all or nothing when killed after %i ms', async (delay) => {
    await startServer()
    const version = unique(`kill-${delay}`)
    const pending = submit(version).catch(() => null)
    await new Promise(r => setTimeout(r, delay))
    child!.kill('SIGKILL')
    await pending
    await new Promise(r => setTimeout(r, 300))
    const s = await stored(version)
    if (s.runs === 0) expect(s).toEqual({ runs: 0, versions: 0, results: 0, files: 0 })
    else expect(s).toEqual({ runs: 1, versions: 1, results: rows, files: 1 })
  }, 120_000)
})
