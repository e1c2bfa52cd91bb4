// Demo runs, made through the running server's own API as a QA engineer and
// a CI job would: two reference sets, then output tables computed here in
// plain binary64 with the usual textbook formulas, the way real codes do —
// so some cases genuinely fail (large n, near zeros, overflow), and the
// pictures show where. Idempotent: existing sets and identical files are reused.
// Usage: tsx scripts/seed-runs.ts [base-url]
import { DEMO_USERS } from '../server/database/seed/scenario'

const base = process.argv[2] ?? 'http://127.0.0.1:3000'
const qa = DEMO_USERS.find(u => u.role === 'qa')!
let cookie = ''

async function call(method: string, path: string, body?: unknown | FormData) {
  const isForm = body instanceof FormData
  const res = await fetch(base + path, {
    method,
    headers: { origin: base, cookie, ...(body && !isForm ? { 'content-type': 'application/json' } : {}) },
    body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
  })
  const set = res.headers.getSetCookie().find(c => c.startsWith('plumbline-session='))
  if (set) cookie = set.split(';')[0]!
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- replies of our own API, each read field by field below
  const json = await res.json().catch(() => null) as any
  if (res.status >= 400 && res.status !== 409) throw new Error(`${method} ${path}: ${res.status} ${json?.message ?? ''}`)
  return { status: res.status, body: json }
}

const range = (param: string, start: string, stop: string, step: string) => ({ param, start, stop, step })

const SETS = [
  {
    name: 'Oscillator basis H_n, n ≤ 60',
    slug: 'osc-basis-h60',
    functionId: 'hermite',
    convention: 'physicists, H_n, weight e^(-x^2)',
    grid: { parts: [{ kind: 'range', axes: [range('n', '0', '60', '4'), range('x', '-8', '8', '0.25')] }] },
    targetDigits: 24,
    criterion: {
      format: 'binary64',
      tolerance: { kind: 'ulps', maxUlps: '8' },
      regions: [{ name: 'tail', when: [{ param: 'x', op: 'absGreaterThan', value: 'sqrt(2*n+1)' }], tolerance: { kind: 'ulps', maxUlps: '64' } }],
      zero: { below: '1e-300', atol: '1e-300' },
      overflow: { signedInf: 'pass' },
    },
    source: 'Plumbline reference engine (certified digits); demo set of the Corrie Point scenario',
  },
  {
    name: 'Beam-mode functions ψ_n, n ≤ 200',
    slug: 'beam-modes-psi200',
    functionId: 'hermite-function',
    convention: 'orthonormal ψ_n(x) = (2^n n! √π)^(-1/2) e^(-x²/2) H_n(x)',
    grid: { parts: [{ kind: 'range', axes: [range('n', '0', '200', '10'), range('x', '-20', '20', '1')] }] },
    targetDigits: 24,
    criterion: {
      format: 'binary64',
      tolerance: { kind: 'mixed', atol: '1e-300', rtol: '1e-13' },
      regions: [],
      zero: { below: '1e-300', atol: '1e-300' },
      overflow: { signedInf: 'fail' },
    },
    source: 'Plumbline reference engine (certified digits); demo set of the Corrie Point scenario',
  },
]

/** H_n(x) by the forward recurrence in binary64. */
function hermite(n: number, x: number): number {
  let a = 1
  let b = 2 * x
  if (n === 0) return a
  for (let k = 1; k < n; k++) [a, b] = [b, 2 * x * b - 2 * k * a]
  return b
}

/** ψ_n the textbook way: normalisation times e^{-x²/2} times H_n; overflows for larger n and |x|. */
function psiNaive(n: number, x: number): number {
  let fact = 1
  for (let k = 2; k <= n; k++) fact *= k
  return hermite(n, x) * Math.exp(-x * x / 2) / Math.sqrt(2 ** n * fact * Math.sqrt(Math.PI))
}

/** ψ_n by the normalised recurrence (DLMF 18.9.1 rescaled), which does not overflow. */
function psiStable(n: number, x: number): number {
  let a = Math.PI ** -0.25 * Math.exp(-x * x / 2)
  if (n === 0) return a
  let b = Math.SQRT2 * x * a
  for (let k = 1; k < n; k++) [a, b] = [b, Math.sqrt(2 / (k + 1)) * x * b - Math.sqrt(k / (k + 1)) * a]
  return b
}

/** A code that rounds its result through binary32 in one release (a real kind of slip). */
const viaFloat32 = (v: number) => Math.fround(v)

async function ensureSet(def: (typeof SETS)[number]) {
  const list = (await call('GET', '/api/reference-sets')).body.sets as Array<{ id: number, slug: string, state: string }>
  let found = list.find(s => s.slug === def.slug)
  if (!found) found = (await call('POST', '/api/reference-sets', def)).body.set
  for (let i = 0; i < 600; i++) {
    const s = (await call('GET', `/api/reference-sets/${found!.id}`)).body.set
    if (s.state === 'ready') return s as { id: number, caseCount: number }
    if (s.state === 'failed') throw new Error(`set ${def.slug} failed: ${s.error}`)
    await new Promise(r => setTimeout(r, 250))
  }
  throw new Error(`set ${def.slug} was not computed in time; is the worker running?`)
}

async function cases(setId: number) {
  const out: Array<Record<string, string>> = []
  for (let page = 1; ; page++) {
    const p = (await call('GET', `/api/reference-sets/${setId}/cases?page=${page}&pageSize=500`)).body
    out.push(...p.rows.map((r: { inputs: Record<string, string> }) => r.inputs))
    if (out.length >= p.total) return out
  }
}

async function submit(code: string, version: string, setId: number, rows: Array<Record<string, string>>, f: (n: number, x: number) => number, env: Record<string, string>) {
  const lines = ['n,x,value', ...rows.map(r => `${r.n},${r.x},${f(Number(r.n), Number(r.x)).toPrecision(17)}`)]
  const form = new FormData()
  form.append('code', code)
  form.append('version', version)
  form.append('setId', String(setId))
  form.append('mapping', JSON.stringify({ n: 'n', x: 'x', value: 'value' }))
  form.append('environment', JSON.stringify(env))
  form.append('file', new Blob([lines.join('\n') + '\n']), `${code}-${version}.csv`)
  const r = await call('POST', '/api/runs', form)
  console.log(`  ${code} ${version}: run ${r.body.run.id}${r.body.duplicate ? ' (already stored)' : ''}`, JSON.stringify(r.body.run.counts))
}

await call('POST', '/api/auth/login', { email: qa.email, password: qa.password })
const [h, psi] = [await ensureSet(SETS[0]!), await ensureSet(SETS[1]!)]
const hRows = await cases(h.id)
const psiRows = await cases(psi.id)
const gcc = { compiler: 'gfortran 13.2', flags: '-O2', platform: 'x86_64-linux', floatFormat: 'binary64' }
await submit('oscillite', '2.3.0', h.id, hRows, (n, x) => viaFloat32(hermite(n, x)), gcc)
await submit('oscillite', '2.4.0', h.id, hRows, hermite, gcc)
await submit('oscillite', '2.4.1', h.id, hRows, hermite, { ...gcc, compiler: 'gfortran 14.1' })
await submit('quadrat', '1.1.0', h.id, hRows, hermite, { compiler: 'clang 18', flags: '-O3', platform: 'x86_64-linux', floatFormat: 'binary64' })
const arm = { compiler: 'gcc 14.1', flags: '-O2', platform: 'aarch64-linux', floatFormat: 'binary64' }
await submit('modeforge', '0.9.0', psi.id, psiRows, psiNaive, arm)
await submit('modeforge', '0.9.1', psi.id, psiRows, psiStable, arm)
console.log('demo runs ready')
