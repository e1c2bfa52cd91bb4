/**
 * No verdict rests on an uncertified digit. A reference certified to d
 * significant digits is within half a unit of its last digit, a relative
 * 5·10^-d at worst (common practice for correctly rounded values); our rule
 * asks every tolerance to be at least ten times that, 5·10^(1−d). The
 * smallest relative bound of an ulps rule is maxUlps·2^-p, since
 * ulp(r)/|r| > 2^-p in the normal range (IEEE 754-2019 §3.3, p = 53 for
 * binary64, 113 for binary128).
 */
import { describe, expect, it } from 'vitest'
import { checkCriterionDigits, checkReferenceSettles, digitsNeededFor } from '../../../shared/compare/criterion'
import { judgeCase } from '../../../shared/compare/judge'
import { parseExactDecimal } from '../../../shared/numeric/exact'
import { referenceSetSchema } from '../../../shared/schemas/reference-set'
import type { Tolerance } from '../../../shared/schemas/criterion'
import { cell, certRef, crit, exactRef, ONE_PLUS_ULP } from './support'

describe('digits needed for a relative bound', () => {
  it.each([
    ['5e-14', 15], ['4.9e-14', 16], ['1e-16', 18], ['1e-30', 32], ['0.5', 2],
  ])('%s needs %i digits', (tol, d) => {
    expect(digitsNeededFor(parseExactDecimal(tol))).toBe(d)
  })
})

describe('definition-time check of criterion against target digits', () => {
  it.each<[Tolerance, 'binary32' | 'binary64' | 'binary128', number, number | null]>([
    [{ kind: 'relative', rtol: '1e-16' }, 'binary64', 17, 18],
    [{ kind: 'relative', rtol: '1e-16' }, 'binary64', 18, null],
    [{ kind: 'mixed', atol: '1e-300', rtol: '1e-16' }, 'binary64', 15, 18],
    // 1 ulp of binary64 is a relative bound down to 2^-53 ≈ 1.11e-16.
    [{ kind: 'ulps', maxUlps: '1' }, 'binary64', 17, 18],
    [{ kind: 'ulps', maxUlps: '1' }, 'binary64', 18, null],
    [{ kind: 'ulps', maxUlps: '0.5' }, 'binary64', 17, 18],
    [{ kind: 'ulps', maxUlps: '4' }, 'binary32', 15, null],
    // 2^-113 ≈ 9.63e-35.
    [{ kind: 'ulps', maxUlps: '1' }, 'binary128', 35, 36],
    [{ kind: 'condition', k: '1', kappaFloor: '1' }, 'binary64', 17, 18],
    [{ kind: 'condition', k: '16', kappaFloor: '1' }, 'binary64', 17, null],
    [{ kind: 'absolute', atol: '1e-40' }, 'binary64', 15, null],
  ])('%j in %s at %i digits needs %s', (tolerance, format, digits, need) => {
    const msgs = checkCriterionDigits(crit({ format, tolerance }), digits)
    if (need === null) expect(msgs).toEqual([])
    else {
      expect(msgs).toHaveLength(1)
      expect(msgs[0]).toMatch(new RegExp(`^Region 'all': .* is tighter than ${digits} certified digits can settle .*Raise the target digits to at least ${need}, or loosen the tolerance\\.$`))
    }
  })

  it('checks every region and names it', () => {
    const c = crit({ tolerance: { kind: 'ulps', maxUlps: '64' }, regions: [{ name: 'core', when: [{ param: 'x', op: 'absLessThan', value: '1' }], tolerance: { kind: 'ulps', maxUlps: '1' } }] })
    expect(checkCriterionDigits(c, 17)).toEqual([expect.stringMatching(/^Region 'core': the ulps rule/)])
  })

  it('says an exact match cannot be settled', () => {
    expect(checkCriterionDigits(crit({ tolerance: { kind: 'ulps', maxUlps: '0' } }), 100)[0]).toMatch(/maxUlps 0 demands an exact match/)
  })

  it('the reference-set schema reports it on targetDigits', () => {
    const r = referenceSetSchema.safeParse({
      name: 'Physicists’ Hermite, moderate degree', slug: 'hermite-moderate', functionId: 'hermite', convention: 'physicists, weight e^{-x^2}',
      grid: { parts: [{ kind: 'points', points: [{ n: '3', x: '0.5' }] }] }, targetDigits: 15,
      criterion: { tolerance: { kind: 'ulps', maxUlps: '1' }, zero: { below: '0', atol: '0' }, overflow: { signedInf: 'fail' } },
    })
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(i => [i.path.join('.'), i.message])).toEqual([['targetDigits', expect.stringMatching(/at least 18/)]])
  })
})

describe('after computing: absolute bounds against each reference', () => {
  it('flags cases whose bound is finer than their certified digits', () => {
    const c = crit({ tolerance: { kind: 'absolute', atol: '1e-10' }, zero: { below: '1e-20', atol: '1e-40' } })
    const issues = checkReferenceSettles(c, [
      { value: '1.0000000000000000000e+0', digits: 20, kappa: null, inputs: { n: '0', x: '1' } },
      { value: '1.0000000000000000000e+12', digits: 20, kappa: null, inputs: { n: '9', x: '20' } },
      { value: '0', digits: 20, kappa: null, inputs: { n: '1', x: '0' } },
      { value: '3.0000000000000000000e-21', digits: 20, kappa: null, inputs: { n: '1', x: '1e-21' } },
    ])
    // 1e12 to 20 digits is known to ±5e-8 > 1e-10 / 10; 3e-21 to ±1.5e-40, 10× that > 1e-40.
    expect(issues.map(i => i.index)).toEqual([1, 3])
    expect(issues[0]!.message).toMatch(/^Case 2 \(n=9, x=20\): the bound 1e-10 is finer than its 20 certified digits can settle/)
  })
})

describe('at judge time, a case within reach of its bound is re-judged at r ± δ', () => {
  const ulp = crit({ tolerance: { kind: 'ulps', maxUlps: '1' } })
  it('exactly one ulp from a 20-digit 1 is unsettled (r − δ lies in the binade below) and fails', () => {
    expect(judgeCase(certRef('1.0000000000000000000', 20), cell(ONE_PLUS_ULP), ulp, {})).toMatchObject({ verdict: 'fail', decidedBy: 'unsettled' })
  })
  it('the same with an exact reference passes', () => {
    expect(judgeCase(exactRef('1'), cell(ONE_PLUS_ULP), ulp, {})).toMatchObject({ verdict: 'pass', decidedBy: 'ulps' })
  })
  it('far from the bound, a certified reference settles', () => {
    expect(judgeCase(certRef('1.2500000000000000000', 20), cell('1.25'), ulp, {})).toMatchObject({ verdict: 'pass', decidedBy: 'ulps' })
  })
  it.each([
    // binary128 keeps the decimal text within 2^-113 relative; δ = 1.5e-19 dominates.
    ['3.0000000003', 'fail', 'unsettled'],
    ['3.00000000030000001', 'fail', 'rtol'],
    ['3.00000000029999999', 'pass', 'rtol'],
  ])('relative 1e-10 around r = 3 (20 digits): c = %s → %s by %s', (m, verdict, decidedBy) => {
    const c = crit({ format: 'binary128', tolerance: { kind: 'relative', rtol: '1e-10' } })
    expect(judgeCase(certRef('3.0000000000000000000', 20), cell(m), c, {})).toMatchObject({ verdict, decidedBy })
  })
})
