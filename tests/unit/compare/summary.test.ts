/**
 * Run summaries: counts by verdict, max / median / RMS relative error and
 * max ULPs, the worst case, and the same per region. Expected figures are
 * worked by hand in the comments.
 */
import { describe, expect, it } from 'vitest'
import { summarizeRun, type RunCaseResult } from '../../../shared/compare/summary'

const r = (verdict: RunCaseResult['verdict'], relError: string | null, ulps: string | null, region?: string, absError: string | null = null): RunCaseResult =>
  ({ verdict, relError, ulps, region, absError, key: `k${Math.random()}` })

const results: RunCaseResult[] = [
  r('pass', '1.000e-16', '4.500e-1', 'all'),
  r('pass', '3.000e-16', '1.350e+0', 'all'),
  r('fail', '4.000e-16', '1.800e+0', 'tail'),
  r('pass', '2.000e-16', '9.000e-1', 'tail'),
  r('pass', null, '0', 'all', '0'), // a zero reference: no relative error
  r('non_finite', null, null, 'tail'),
  r('missing', null, null, 'all'),
  r('duplicate', null, null, 'all'),
  r('unexpected', null, null),
  r('accepted', '5.000e-10', '2.251e+6', 'tail'),
]

describe('summarizeRun over the whole run', () => {
  const s = summarizeRun(results)
  it('counts every verdict', () => {
    expect(s.total).toBe(10)
    expect(s.counts).toEqual({ pass: 4, fail: 1, missing: 1, unexpected: 1, non_finite: 1, duplicate: 1, accepted: 1 })
  })
  it('max, median and RMS of the relative errors of judged cases', () => {
    // {1, 2, 3, 4}e-16 and 5e-10: max 5e-10; median = 3e-16 (middle of five);
    // RMS = sqrt((1 + 4 + 9 + 16)e-32 + 25e-20) / 5) = sqrt(5.0000000006e-20) ≈ 2.236e-10.
    expect(s.maxRelError).toBe('5.000e-10')
    expect(s.medianRelError).toBe('3.000e-16')
    expect(s.rmsRelError).toBe('2.236e-10')
    expect(s.maxUlps).toBe('2.251e+6')
  })
  it('the worst case is the non-finite one (it ranks above failures)', () => {
    expect(s.worst).toMatchObject({ index: 5, verdict: 'non_finite', region: 'tail' })
  })
})

describe('summarizeRun per region', () => {
  const s = summarizeRun(results)
  it('lists the regions the cases carry (unexpected rows belong to none)', () => {
    expect(Object.keys(s.regions).sort()).toEqual(['all', 'tail'])
    expect(s.regions.all!.total + s.regions.tail!.total).toBe(9)
  })
  it('region all: {1, 3}e-16 → median 2e-16, RMS sqrt(5)e-16', () => {
    const a = s.regions.all!
    expect(a.counts).toMatchObject({ pass: 3, missing: 1, duplicate: 1, fail: 0 })
    expect([a.maxRelError, a.medianRelError, a.rmsRelError, a.maxUlps]).toEqual(['3.000e-16', '2.000e-16', '2.236e-16', '1.350e+0'])
    expect(a.worst).toMatchObject({ index: 1, verdict: 'pass', relError: '3.000e-16' })
  })
  it('region tail: {4e-16, 2e-16, 5e-10} → median 4e-16; worst the non-finite case', () => {
    const t = s.regions.tail!
    // RMS = sqrt((16e-32 + 4e-32 + 25e-20) / 3) = sqrt(8.33333334e-20) ≈ 2.887e-10.
    expect([t.maxRelError, t.medianRelError, t.rmsRelError]).toEqual(['5.000e-10', '4.000e-16', '2.887e-10'])
    expect(t.worst).toMatchObject({ index: 5, verdict: 'non_finite' })
  })
})

describe('edge cases', () => {
  it('an even count takes the mean of the two middle values', () => {
    // {1, 2, 4, 8}e-20: median (2 + 4)/2 = 3e-20; RMS sqrt(85/4)e-20 ≈ 4.610e-20.
    const s = summarizeRun(['1e-20', '8e-20', '2e-20', '4e-20'].map(e => r('pass', e, '1')))
    expect([s.medianRelError, s.rmsRelError, s.maxRelError]).toEqual(['3.000e-20', '4.610e-20', '8.000e-20'])
  })
  it('among failures the larger relative error is worse, then the larger absolute error', () => {
    const s = summarizeRun([r('fail', '1.000e-10', null, 'all'), r('fail', '2.000e-10', null, 'all'), r('fail', null, null, 'all', '1e-3'), r('pass', '9.000e-1', null, 'all')])
    expect(s.worst!.index).toBe(1)
    expect(summarizeRun([r('fail', null, null, 'all', '1e-3'), r('fail', null, null, 'all', '2e-3')]).worst!.index).toBe(1)
  })
  it('huge and tiny errors neither overflow nor underflow', () => {
    const s = summarizeRun([r('fail', '1.000e+400', '1e+420'), r('fail', '3.000e+400', null), r('pass', '1.000e-400', null)])
    // RMS ≈ sqrt((1 + 9)/3)e400 = 1.826e+400; median 1e400.
    expect([s.maxRelError, s.medianRelError, s.rmsRelError, s.maxUlps]).toEqual(['3.000e+400', '1.000e+400', '1.826e+400', '1.000e+420'])
  })
  it('an empty run has zero counts and no figures', () => {
    const s = summarizeRun([])
    expect(s.counts.pass).toBe(0)
    expect([s.maxRelError, s.medianRelError, s.rmsRelError, s.maxUlps, s.worst]).toEqual([null, null, null, null, null])
    expect(s.regions).toEqual({})
  })
})
