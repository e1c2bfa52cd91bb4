// Submission workload, end to end through the built server: a 100,000-case
// reference set, then one 100,000-row output table uploaded, parsed, judged
// and stored in one transaction, three times back to back (as three versions;
// PLUMBLINE_SUBMISSIONS sets how many). Prints the median wall time, the
// server's peak RSS after the first and after the last, and the ratio against
// a plain read (bytes → lines → fields) of the same file measured in the same
// run. Uses its own MariaDB instance (`bench`, port 3310).
import { execFileSync, spawn } from 'node:child_process'
import { readFileSync, existsSync } from 'node:fs'
import { join } from 'node:path'

const root = join(import.meta.dirname, '..')
const PORT = 3190
const SUBMISSIONS = Number(process.env.PLUMBLINE_SUBMISSIONS ?? 3)
const BASE = `http://127.0.0.1:${PORT}`
const sh = (...args: string[]) => execFileSync('bash', args, { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] })

sh('scripts/db.sh', 'reset', 'bench')
const url = sh('scripts/db.sh', 'url', 'bench').trim()
const env = { ...process.env, NUXT_DATABASE_URL: url }
execFileSync('npx', ['tsx', 'scripts/migrate.ts'], { cwd: root, env, stdio: 'ignore' })
execFileSync('npx', ['tsx', 'scripts/seed.ts'], { cwd: root, env, stdio: 'ignore' })
if (!existsSync(join(root, '.output/server/index.mjs'))) execFileSync('npx', ['nuxt', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] })

const server = spawn('node', ['.output/server/index.mjs'], { cwd: root, env: { ...env, PLUMBLINE_TIMING: process.env.PLUMBLINE_TIMING ?? '0', PORT: String(PORT), HOST: '127.0.0.1', NUXT_SESSION_PASSWORD: 'plumbline-bench-session-password-0123456789' }, stdio: ['ignore', 'inherit', 'inherit'] })
const worker = spawn('node', ['--import', 'tsx', 'scripts/worker.ts'], { cwd: root, env, stdio: 'ignore' })
const stop = () => { server.kill('SIGKILL'); worker.kill('SIGKILL') }
process.on('exit', stop)

const peakRss = (pid: number) => Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) / 1024

try {
  for (let i = 0; i < 100 && !(await fetch(`${BASE}/api/health`).then(r => r.ok).catch(() => false)); i++) await new Promise(r => setTimeout(r, 100))
  const login = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', origin: BASE }, body: JSON.stringify({ email: 'qa@corrie-point.test', password: 'demo-qa-2026' }) })
  const cookie = login.headers.getSetCookie()[0]!.split(';')[0]!
  const headers = { cookie, origin: BASE }

  // 100 × 1000 = 100,000 cases: n = 0…99, x = -5 … 4.99 in steps of 0.01
  const def = {
    name: 'Bench 100k', slug: 'bench-100k', functionId: 'hermite', convention: 'physicists', targetDigits: 20,
    grid: { parts: [{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '99', step: '1' }, { param: 'x', start: '-5', stop: '4.99', step: '0.01' }] }] },
    criterion: { format: 'binary64', tolerance: { kind: 'ulps', maxUlps: '8' }, zero: { below: '1e-300', atol: '1e-300' }, overflow: { signedInf: 'pass' } },
  }
  const t0 = performance.now()
  const created = await (await fetch(`${BASE}/api/reference-sets`, { method: 'POST', headers: { ...headers, 'content-type': 'application/json' }, body: JSON.stringify(def) })).json() as { set: { id: number } }
  let state = ''
  while (state !== 'ready') {
    await new Promise(r => setTimeout(r, 500))
    state = ((await (await fetch(`${BASE}/api/reference-sets/${created.set.id}`, { headers })).json()) as { set: { state: string, error?: string } }).set.state
    if (state === 'failed') throw new Error('the bench set failed')
  }
  const setSeconds = (performance.now() - t0) / 1000

  const lines = ['n,x,H']
  for (let n = 0; n < 100; n++) {
    for (let i = -500; i < 500; i++) {
      const x = i / 100
      let a = 1
      let b = 2 * x
      if (n === 0) b = 1
      for (let k = 1; k < n; k++) [a, b] = [b, 2 * x * b - 2 * k * a]
      lines.push(`${n},${x},${b.toPrecision(17)}`)
    }
  }
  const table = Buffer.from(lines.join('\n') + '\n')

  // the reference: a plain read of the same bytes into lines and fields (median of 5)
  let fields = 0
  const plainTimes: number[] = []
  for (let i = 0; i < 5; i++) {
    const r0 = performance.now()
    fields = 0
    for (const line of table.toString('utf8').split('\n')) fields += line.split(',').length
    plainTimes.push(performance.now() - r0)
  }
  const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)]!
  const plainMs = median(plainTimes)

  // the same table submitted as three versions (a repeat for one version would be recognised, not judged)
  const submitTimes: number[] = []
  let firstPeak = 0
  let body: { run?: { id: number, counts: Record<string, number> }, message?: string } = {}
  for (let i = 1; i <= SUBMISSIONS; i++) {
    const form = new FormData()
    form.append('code', 'oscillite')
    form.append('version', `bench-${i}`)
    form.append('setId', String(created.set.id))
    form.append('file', new Blob([table]), 'bench.csv')
    const s0 = performance.now()
    const res = await fetch(`${BASE}/api/runs`, { method: 'POST', headers, body: form })
    submitTimes.push(performance.now() - s0)
    if (i === 1) firstPeak = peakRss(server.pid!)
    body = await res.json() as typeof body
    if (res.status !== 201) throw new Error(`submission failed: ${res.status} ${body.message}`)
  }
  const submitMs = median(submitTimes)

  // what the code owner opens next: the error map (binned past 8,000 cases) and the worst page of the case table
  const timed = async (path: string) => {
    const t = performance.now()
    const r = await fetch(`${BASE}${path}`, { headers })
    const bytes = (await r.arrayBuffer()).byteLength
    if (!r.ok) throw new Error(`${path}: ${r.status}`)
    return { ms: performance.now() - t, bytes }
  }
  const mapRead = await timed(`/api/runs/${body.run!.id}/map`)
  const pageRead = await timed(`/api/runs/${body.run!.id}/cases?verdict=fail&sort=relError&dir=desc&page=1&pageSize=50`)

  console.log('workload                                        time        peak RSS   ratio to plain read')
  console.log(`(d) reference set, 100,000 cases (worker)     ${setSeconds.toFixed(1).padStart(6)} s`)
  console.log(`(e) submit 100,000 rows: parse, judge, store  ${(submitMs / 1000).toFixed(2).padStart(6)} s   ${firstPeak.toFixed(0).padStart(5)} MB   ${(submitMs / plainMs).toFixed(0)}× (plain read ${plainMs.toFixed(0)} ms, ${fields} fields)`)
  console.log(`    median of ${SUBMISSIONS} submissions (${submitTimes.map(t => (t / 1000).toFixed(2)).join(' s, ')} s); peak RSS after the first ${firstPeak.toFixed(0)} MB,`)
  console.log(`    after all ${SUBMISSIONS} back to back ${peakRss(server.pid!).toFixed(0)} MB (heap growth capped in server/plugins/heap-growth.ts); plain reads ${plainTimes.map(t => t.toFixed(0)).join(', ')} ms`)
  console.log(`(f) error map of that run                      ${(mapRead.ms / 1000).toFixed(2).padStart(6)} s   ${(mapRead.bytes / 1024).toFixed(0)} KB of JSON`)
  console.log(`(g) worst 50 failures, case table page          ${(pageRead.ms / 1000).toFixed(2).padStart(6)} s`)
  console.log(`    targets: (e) under 5 s and under 600 MB peak RSS; counts ${JSON.stringify(body.run!.counts)}`)
}
finally {
  stop()
  sh('scripts/db.sh', 'stop', 'bench')
}
