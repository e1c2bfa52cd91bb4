/**
 * A whole run end to end: expansion, matching, judging and the summary,
 * on a small invented scenario (an in-house code's H_n table with one row
 * missing, one written twice, one extra and one NaN).
 */
import { describe, expect, it } from 'vitest'
import { judgeRun, judgeRunInChunks } from '../../../shared/compare/run'
import { expandReferenceSet } from '../../../shared/grid/index'
import { cell, crit } from './support'

// H_2(x) = 4x² − 2 and H_3(x) = 8x³ − 12x (DLMF 18.3, Table 18.3.1): exact at these x.
const exactH: Record<string, string> = { 'n=2;x=0.5': '-1', 'n=2;x=1': '2', 'n=3;x=0.5': '-5', 'n=3;x=1': '-4', 'n=3;x=2': '40' }
const criterion = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'wide', when: [{ param: 'x', op: 'atLeast', value: '2' }], tolerance: { kind: 'ulps', maxUlps: '8' } }] })
const cases = expandReferenceSet({ functionId: 'hermite', criterion, grid: { parts: [{ kind: 'range', axes: [{ param: 'n', values: ['2', '3'] }, { param: 'x', values: ['0.5', '1'] }] }, { kind: 'points', points: [{ n: '3', x: '2' }] }] } })
  .map(c => ({ ...c, reference: { value: exactH[c.key]!, digits: 30, kappa: null, exact: true } }))

const rows = [
  { inputs: { n: '2', x: '0.50' }, measured: cell('-1.0000000000000002') }, // names −1 − 2^-52: 1 ulp, pass
  { inputs: { n: '3', x: '0.5' }, measured: cell('-5.000000000000002') }, // names −5 − 2·2^-50: 2 ulps, fail
  { inputs: { n: '3', x: '0.5' }, measured: cell('-5') }, // duplicate: not judged
  { inputs: { n: '3', x: '1' }, measured: cell('nan') },
  { inputs: { n: '3', x: '2' }, measured: cell('40.00000000000004') }, // names 40 + 6·2^-47: 6 ulps, region wide: pass
  { inputs: { n: '9', x: '1' }, measured: cell('1') }, // no such case
]

describe('judgeRun', () => {
  const { results, summary } = judgeRun('hermite', cases, rows, criterion)
  it('gives every case and row one result, cases first in case order', () => {
    expect(results.map(r => [r.key, r.verdict, r.decidedBy])).toEqual([
      ['n=2;x=0.5', 'pass', 'ulps'],
      ['n=2;x=1', 'missing', 'no-row'],
      ['n=3;x=0.5', 'fail', 'ulps'],
      ['n=3;x=1', 'non_finite', 'nan-rule'],
      ['n=3;x=2', 'pass', 'region:wide/ulps'],
      ['n=3;x=0.5', 'duplicate', 'duplicate-of-row:1'],
      ['n=9;x=1', 'unexpected', 'no-case'],
    ])
    expect(results[5]!.measured).toBe('-5')
    expect(results[4]).toMatchObject({ ulps: '6.000e+0', region: 'wide' })
    expect(results[2]).toMatchObject({ ulps: '2.000e+0', relError: '3.553e-16' })
  })
  it('summarises the run', () => {
    expect(summary.counts).toEqual({ pass: 2, fail: 1, missing: 1, unexpected: 1, non_finite: 1, duplicate: 1, accepted: 0 })
    expect(summary.worst).toMatchObject({ key: 'n=3;x=1', verdict: 'non_finite' })
    expect(Object.keys(summary.regions).sort()).toEqual(['all', 'wide'])
    expect(summary.regions.wide!.counts.pass).toBe(1)
  })
})

describe('judgeRunInChunks', () => {
  it('hands out the same results in order, in chunks of the asked size, and returns the same summary', () => {
    const whole = judgeRun('hermite', cases, rows, criterion)
    const steps = judgeRunInChunks('hermite', cases, rows, criterion, 2)
    const chunks: unknown[][] = []
    let step = steps.next()
    for (; !step.done; step = steps.next()) chunks.push(step.value)
    expect(chunks.map(c => c.length)).toEqual([2, 2, 3])
    expect(chunks.flat()).toEqual(whole.results)
    expect(step.value.worst).toEqual(whole.results[whole.summary.worst!.index])
    expect(step.value.summary).toEqual(whole.summary)
  })
})
