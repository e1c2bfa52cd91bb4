// Board workload, through the built server: the invented load scenario of
// 50 codes × 30 versions × 10 reference sets (scripts/seed-large.ts, about
// 14,600 runs), then the board read 50 times in each of three shapes. Prints
// p50 and p95 of the time to the full reply on loopback, and the ratio to a
// trivial request (/api/health) measured the same way in the same run.
// Uses its own MariaDB instance (`bench`) and port PORT + 190 (3190 by default).
import { execFileSync, spawn } from 'node:child_process'
import { existsSync } from 'node:fs'
import { join } from 'node:path'

const root = join(import.meta.dirname, '..')
const PORT = Number(process.env.PORT ?? 3000) + 190
const BASE = `http://127.0.0.1:${PORT}`
const REPEATS = 50
const WARM = 5
const sh = (...args: string[]) => execFileSync('bash', args, { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] })

sh('scripts/db.sh', 'reset', 'bench')
const url = sh('scripts/db.sh', 'url', 'bench').trim()
const env = { ...process.env, NUXT_DATABASE_URL: url }
execFileSync('npx', ['tsx', 'scripts/migrate.ts'], { cwd: root, env, stdio: 'ignore' })
const seeded = execFileSync('npx', ['tsx', 'scripts/seed.ts', '--large'], { cwd: root, env, encoding: 'utf8' }).trim().split('\n').at(-1)
if (!existsSync(join(root, '.output/server/index.mjs'))) execFileSync('npx', ['nuxt', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] })

const server = spawn('node', ['.output/server/index.mjs'], { cwd: root, env: { ...env, PORT: String(PORT), HOST: '127.0.0.1', NUXT_SESSION_PASSWORD: 'plumbline-bench-session-password-0123456789' }, stdio: ['ignore', 'inherit', 'inherit'] })
const stop = () => server.kill('SIGKILL')
process.on('exit', stop)

function quantile(sorted: number[], q: number) {
  const i = (sorted.length - 1) * q
  const lo = Math.floor(i)
  return sorted[lo]! + (sorted[Math.ceil(i)]! - sorted[lo]!) * (i - lo)
}

async function measure(path: string, headers: Record<string, string>) {
  let bytes = 0
  const once = async () => {
    const t = performance.now()
    const res = await fetch(BASE + path, { headers })
    const body = await res.arrayBuffer()
    if (res.status !== 200) throw new Error(`${path}: ${res.status}`)
    bytes = body.byteLength
    return performance.now() - t
  }
  for (let i = 0; i < WARM; i++) await once()
  const times: number[] = []
  for (let i = 0; i < REPEATS; i++) times.push(await once())
  times.sort((a, b) => a - b)
  return { p50: quantile(times, 0.5), p95: quantile(times, 0.95), bytes }
}

try {
  for (let i = 0; i < 100 && !(await fetch(`${BASE}/api/health`).then(r => r.ok).catch(() => false)); i++) await new Promise(r => setTimeout(r, 100))
  const login = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': BASE }, body: JSON.stringify({ email: 'viewer@corrie-point.test', password: 'demo-viewer-2026' }) })
  const headers = { cookie: login.headers.getSetCookie()[0]!.split(';')[0]! }

  const health = await measure('/api/health', headers)
  const rows: [string, Awaited<ReturnType<typeof measure>>][] = [
    ['(f) GET /api/board, every cell (50 × 30 × 10)', await measure('/api/board', headers)],
    ['(g) GET /api/board as the page asks (newest 6, 10 codes)', await measure('/api/board?recent=6&page=1&pageSize=10', headers)],
    ['(h) GET / board page, server-rendered HTML', await measure('/', headers)],
  ]
  console.log(`board workload: ${seeded}; ${REPEATS} requests each after ${WARM} warm-up, one at a time, time to the whole reply on loopback`)
  console.log('workload                                                    p50 ms    p95 ms    reply      p50 ratio to /api/health')
  for (const [name, r] of rows) {
    console.log(`${name.padEnd(58)} ${r.p50.toFixed(1).padStart(8)}  ${r.p95.toFixed(1).padStart(8)}  ${(r.bytes / 1024).toFixed(0).padStart(6)} kB   ${(r.p50 / health.p50).toFixed(0)}×`)
  }
  console.log(`    reference: GET /api/health p50 ${health.p50.toFixed(2)} ms, p95 ${health.p95.toFixed(2)} ms`)
}
finally {
  stop()
  sh('scripts/db.sh', 'stop', 'bench')
}
