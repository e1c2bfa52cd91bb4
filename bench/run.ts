/**
 * npm run bench — the reference engine against mpmath on the same
 * workloads, in one run, printing the ratio for each (a benchmark, never a
 * timed test). mpmath is Debian's python3-mpmath with the gmpy backend,
 * driven by bench/mpmath_bench.py under /usr/bin/python3.
 *
 *  (a) H_0 … H_100 at 200 points in [−10, 10], 50 certified digits (all
 *      20 200 values as correctly rounded strings), against mpmath's plain
 *      three-term recurrence at 50 digits and mpmath.hermite per point.
 *  (b) the 100-point Gauss–Hermite rule at 50 digits, against Newton's
 *      iteration in mpmath from double-precision starts.
 *  (c) M(a, b, z) at 1000 random points at 50 digits, against mpmath.hyp1f1.
 */
import { spawnSync } from 'node:child_process'
import { resolve, dirname } from 'node:path'
import { fileURLToPath } from 'node:url'
import { hermiteTable } from '../shared/reference/hermite'
import { gaussHermiteRule } from '../shared/reference/gauss-hermite'
import { kummer } from '../shared/reference/kummer'
import { parseExactDecimal } from '../shared/numeric/exact'

const DIGITS = 50
const PYTHON = '/usr/bin/python3'

/** Best wall time and best process CPU time (ms) over the repeats. */
function bestOf(fn: () => void, repeats: number): [number, number] {
  let wall = Infinity
  let cpu = Infinity
  for (let i = 0; i < repeats; i++) {
    const t = performance.now()
    const c = process.cpuUsage()
    fn()
    const u = process.cpuUsage(c)
    wall = Math.min(wall, performance.now() - t)
    cpu = Math.min(cpu, (u.user + u.system) / 1000)
  }
  return [wall, cpu]
}

// Workload inputs, as exact decimal strings shared with the mpmath side.
const aPoints = Array.from({ length: 200 }, (_, i) => (-10 + (20 * (i + 0.5)) / 200).toFixed(3))
let seed = 20261201
const rnd = () => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648 }
const cPoints = Array.from({ length: 1000 }, () => [
  (rnd() * 10 - 5).toFixed(3), (rnd() * 10 + 0.5).toFixed(3), (rnd() * 40 - 20).toFixed(3),
])

const xs = aPoints.map((x) => parseExactDecimal(x))
const kc = cPoints.map(([a, b, z]) => [parseExactDecimal(a!), parseExactDecimal(b!), parseExactDecimal(z!)] as const)

let uncertified = 0
const runA = () => {
  const t = hermiteTable('H', 100, xs, DIGITS)
  uncertified = t.flat().filter((c) => c.digits < DIGITS).length
}
const runB = () => {
  const r = gaussHermiteRule(100, 'physicists', DIGITS)
  uncertified += [...r.nodes, ...r.weights].filter((c) => c.digits < DIGITS).length
}
const runC = () => { for (const [a, b, z] of kc) if (kummer(a, b, z, DIGITS).digits < DIGITS) uncertified++ }

runA(); runB(); runC() // warm-up, as on the mpmath side
uncertified = 0
const ours = { a: bestOf(runA, 10), b: bestOf(runB, 10), c: bestOf(runC, 10) }

const py = spawnSync(PYTHON, [resolve(dirname(fileURLToPath(import.meta.url)), 'mpmath_bench.py')], {
  input: JSON.stringify({ digits: DIGITS, a_points: aPoints, a_nmax: 100, b_n: 100, c_points: cPoints }),
  encoding: 'utf8', maxBuffer: 16 << 20,
})
if (py.status !== 0) {
  console.error(`mpmath side failed (is python3-mpmath installed for ${PYTHON}?)\n${py.stderr}`)
  process.exit(1)
}
const mp = JSON.parse(py.stdout) as Record<string, [number, number] | string>
const m = (k: string) => mp[k] as [number, number]

type Row = [string, [number, number], string, [number, number], number, string]
const rows: Row[] = [
  ['(a) H_0..H_100 × 200 x, 50 digits', ours.a, 'mpmath recurrence', m('a_recurrence'), 1, 'ratio ≥ 1'],
  ['', ours.a, 'mpmath.hermite per point', m('a_hermite'), 15, 'ratio ≥ 15'],
  ['(b) Gauss–Hermite n = 100, 50 digits', ours.b, 'mpmath Newton, double starts', m('b_newton'), 1, 'ratio > 1'],
  ['(c) M(a,b,z) × 1000, 50 digits', ours.c, 'mpmath.hyp1f1', m('c_hyp1f1'), 0.5, 'ratio ≥ 0.5'],
]
console.log(`mpmath ${mp.version} (backend ${mp.backend}) via ${PYTHON}; node ${process.version}; best of 10 after a warm-up (mpmath.hermite: one pass)`)
console.log('ratio = mpmath time / engine time (above 1: the engine is faster); wall clock and process CPU time')
console.log('(CPU time is less disturbed by other load on the machine; node\'s includes its GC threads)\n')
const f = (v: number) => v.toFixed(1).padStart(9)
console.log(`${'workload'.padEnd(38)}${'engine wall/cpu ms'.padStart(20)}  ${'against'.padEnd(29)}${'mpmath wall/cpu ms'.padStart(20)}${'ratio wall/cpu'.padStart(16)}  target`)
for (const [w, e, what, mm, target, label] of rows) {
  const rw = mm[0] / e[0]
  const rc = mm[1] / e[1]
  const verdict = rw >= target && rc >= target ? 'met' : rw >= target || rc >= target ? 'met on one clock only' : 'NOT met'
  console.log(`${w.padEnd(38)}${f(e[0])} /${f(e[1])}  ${what.padEnd(29)}${f(mm[0])} /${f(mm[1])}${rw.toFixed(2).padStart(8)} /${rc.toFixed(2).padStart(6)}  ${label}: ${verdict}`)
}
const us = (ms: number) => (ms * 1000 / 20200).toFixed(2)
console.log(`\nper value (a), wall: engine ${us(ours.a[0])} µs, mpmath recurrence ${us(m('a_recurrence')[0])} µs, mpmath.hermite ${us(m('a_hermite')[0])} µs`)
console.log(`values short of ${DIGITS} certified digits: ${uncertified}`)
