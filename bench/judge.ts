/**
 * npx tsx bench/judge.ts — judging speed (a benchmark, never a timed test).
 *
 * Workload: a 100 000-case H_n(x) set (n = 0…99, 1000 points x in
 * [−12, 12] with 3 decimals), references from the engine at 20 digits
 * (evaluateBatch, not timed), measured values from a plain binary64
 * three-term recurrence printed with 17 significant digits, as a real code
 * would write them. It loses accuracy for large n and near zeros, so
 * verdicts are mixed. Criterion: 4 ULPs in binary64, 64 ULPs where
 * |x| > sqrt(2n+1), zero rule below 1e-300.
 * Timed: matching rows to cases by input key, judging every case, and the
 * run summary. Prints cases/s for each and in total.
 */
import { evaluateBatch } from '../shared/reference/index'
import { expandReferenceSet } from '../shared/grid/index'
import { judgeCase, matchRows, referenceFromOutput, summarizeRun, compileCriterion, type MeasuredValue, type RunCaseResult } from '../shared/compare/index'
import { criterionSchema } from '../shared/schemas/criterion'

const criterion = criterionSchema.parse({
  format: 'binary64',
  tolerance: { kind: 'ulps', maxUlps: '4' },
  regions: [{ name: 'tail', when: [{ param: 'x', op: 'absGreaterThan', value: 'sqrt(2*n+1)' }], tolerance: { kind: 'ulps', maxUlps: '64' } }],
  zero: { below: '1e-300', atol: '1e-300' },
  overflow: { signedInf: 'pass' },
})

const t0 = performance.now()
const cases = expandReferenceSet({
  functionId: 'hermite', criterion,
  grid: { parts: [{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '99', step: '1' }, { param: 'x', start: '-12', stop: '11.976', step: '0.024' }] }] },
})
const tExpand = performance.now() - t0
const refs = evaluateBatch('hermite', cases.map(c => c.inputs), 20).map(r => referenceFromOutput(r.outputs[0]!))

/** The usual recurrence in binary64: H_0 = 1, H_1 = 2x, H_{k+1} = 2x H_k − 2k H_{k−1}. */
function plainHermite(n: number, x: number): number {
  let a = 1
  let b = 2 * x
  if (n === 0) return a
  for (let k = 1; k < n; k++) [a, b] = [b, 2 * x * b - 2 * k * a]
  return b
}
const rows = cases.map(c => ({ inputs: c.inputs, value: plainHermite(Number(c.inputs.n), Number(c.inputs.x)) }))
  .reverse() // a solver may write its rows in any order
const measured = (v: number): MeasuredValue => Number.isFinite(v) ? { raw: v.toPrecision(17), kind: 'number' }
  : Number.isNaN(v) ? { raw: 'nan', kind: 'nan' } : { raw: v > 0 ? 'inf' : '-inf', kind: 'inf', sign: v > 0 ? 1 : -1 }

compileCriterion(criterion)
const rate = (n: number, ms: number) => `${Math.round(n / (ms / 1000)).toLocaleString('en')} cases/s (${ms.toFixed(0)} ms)`
// CPU time of this process as well as wall time: on a shared machine the wall clock also counts other jobs.
const cpuMs = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1000 }
for (let round = 0; round < 3; round++) {
  const c1 = cpuMs()
  const t1 = performance.now()
  const m = matchRows(cases, rows, 'hermite')
  const t2 = performance.now()
  const c2 = cpuMs()
  const results: RunCaseResult[] = new Array(cases.length)
  for (const { caseIndex, rowIndex } of m.matched) {
    const cs = cases[caseIndex]!
    const j: RunCaseResult = judgeCase(refs[caseIndex]!, measured(rows[rowIndex]!.value), criterion, cs.inputs, { region: cs.region })
    j.key = cs.key
    results[caseIndex] = j
  }
  const t3 = performance.now()
  const c3 = cpuMs()
  const s = summarizeRun(results)
  const t4 = performance.now()
  const c4 = cpuMs()
  console.log(`round ${round + 1} wall: match ${rate(cases.length, t2 - t1)}; judge ${rate(cases.length, t3 - t2)}; summary ${rate(cases.length, t4 - t3)}; total ${rate(cases.length, t4 - t1)}`)
  console.log(`round ${round + 1} cpu:  match ${rate(cases.length, c2 - c1)}; judge ${rate(cases.length, c3 - c2)}; summary ${rate(cases.length, c4 - c3)}; total ${rate(cases.length, c4 - c1)}`)
  if (round === 2) {
    console.log(`expand ${rate(cases.length, tExpand)}`)
    console.log('counts', JSON.stringify(s.counts), 'max rel', s.maxRelError, 'median', s.medianRelError, 'rms', s.rmsRelError, 'max ulps', s.maxUlps)
    console.log('regions', Object.entries(s.regions).map(([k, f]) => `${k}: ${f.total} cases, ${f.counts.pass} pass, ${f.counts.fail} fail, max ulps ${f.maxUlps}`).join('; '))
    console.log('worst', JSON.stringify(s.worst), 'peak RSS', `${Math.round(process.resourceUsage().maxRSS / 1024)} MB`)
  }
}
