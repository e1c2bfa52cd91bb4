/**
 * The rules outside the tolerance: reference zeros and tiny references,
 * overflow (±inf with the right sign, pass or fail as chosen), NaN, and
 * cells that are not numbers. Format limits: binary64 largest finite
 * (2 − 2^-52)·2^1023 ≈ 1.7976931348623157e308, binary32 largest finite
 * (2 − 2^-23)·2^127 ≈ 3.4028235e38 (IEEE 754-2019 Table 3.5; decimal
 * renderings from memory, re-derived with CPython fractions when writing).
 */
import { describe, expect, it } from 'vitest'
import { judgeCase } from '../../../shared/compare/judge'
import { cell, certRef, crit, exactRef } from './support'

const X = { n: '1', x: '0.5' }
const ulps1 = { kind: 'ulps', maxUlps: '1' } as const

describe('zero rule', () => {
  const c = crit({ tolerance: ulps1, zero: { below: '1e-300', atol: '1e-300' } })
  it.each([
    [exactRef('0'), '0', 'pass', 'zero-rule'],
    [exactRef('0'), '-0', 'pass', 'zero-rule'],
    [exactRef('0'), '5e-301', 'pass', 'zero-rule'],
    [exactRef('0'), '2e-300', 'fail', 'zero-rule'],
    // Below the stated magnitude, a nonzero reference is judged absolutely too.
    [certRef('1.2345678901234567890e-310', 20), '0', 'pass', 'zero-rule'],
    [certRef('1.2345678901234567890e-310', 20), '2e-300', 'fail', 'zero-rule'],
    // At or above it, the tolerance decides.
    [exactRef('1e-299'), '0', 'fail', 'ulps'],
  ])('r = %j, c = %s → %s by %s', (ref, m, verdict, decidedBy) => {
    const j = judgeCase(ref, cell(m), c, X)
    expect([j.verdict, j.decidedBy]).toEqual([verdict, decidedBy])
  })

  it('with below = 0 only an exact zero is judged absolutely; relative error is then undefined', () => {
    const strict = crit({ tolerance: ulps1, zero: { below: '0', atol: '0' } })
    expect(judgeCase(exactRef('0'), cell('0'), strict, X)).toMatchObject({ verdict: 'pass', decidedBy: 'zero-rule', relError: null, absError: '0', digitsAgreed: 30 })
    expect(judgeCase(exactRef('0'), cell('4.9e-324'), strict, X)).toMatchObject({ verdict: 'fail', decidedBy: 'zero-rule', relError: null, digitsAgreed: 0 })
    expect(judgeCase(certRef('1.2345678901234567890e-310', 20), cell('0'), strict, X)).toMatchObject({ verdict: 'fail', decidedBy: 'ulps' })
  })
})

describe('overflow rule', () => {
  const passInf = crit({ tolerance: ulps1, overflow: { signedInf: 'pass' } })
  const failInf = crit({ tolerance: ulps1, overflow: { signedInf: 'fail' } })
  const big = certRef('4.6960437006492517671e+748', 20)
  const negBig = certRef('-2.0000000000000000000e+308', 20)
  it.each([
    [passInf, big, 'inf', 'pass'],
    [passInf, big, 'Infinity', 'pass'],
    [failInf, big, 'inf', 'fail'],
    [passInf, big, '-inf', 'fail'],
    [passInf, negBig, '-inf', 'pass'],
    [passInf, negBig, '+inf', 'fail'],
    // Text beyond binary64's range names +inf in the format.
    [passInf, big, '4.6960437006492517671e+748', 'pass'],
    [failInf, big, '1e400', 'fail'],
  ])('%#: reference past the largest finite value, c = %s', (c, ref, m, verdict) => {
    const j = judgeCase(ref, cell(m), c, X)
    expect([j.verdict, j.decidedBy]).toEqual([verdict, 'overflow-rule'])
  })

  it.each([
    ['1.7976931348623157e308', 20, 'inf'],
    ['1', 30, 'inf'],
    ['-1', 30, '-inf'],
  ])('a finite, representable reference %s against %s is non_finite', (value, digits, m) => {
    expect(judgeCase({ value, digits, kappa: null }, cell(m), passInf, X)).toMatchObject({ verdict: 'non_finite', decidedBy: 'overflow-rule', ulps: null })
  })

  it('a finite measured value against an overflowing reference is judged by the tolerance', () => {
    expect(judgeCase(big, cell('1.7976931348623157e308'), passInf, X)).toMatchObject({ verdict: 'fail', decidedBy: 'ulps' })
  })

  it.each([
    ['1e39', 'inf', 'pass'],
    ['3.4028236e38', 'inf', 'pass'],
    ['3.4028234e38', 'inf', 'non_finite'],
    ['1e39', '3.5e38', 'pass'],
  ])('binary32: reference %s, c = %s → %s', (value, m, verdict) => {
    const c = crit({ format: 'binary32', tolerance: ulps1 })
    expect(judgeCase({ value, digits: 20, kappa: null }, cell(m), c, X).verdict).toBe(verdict)
  })
})

describe('NaN rule and cells that are not numbers', () => {
  it.each([
    [undefined, 'nan', 'non_finite', 'nan-rule'],
    [undefined, '-NaN', 'non_finite', 'nan-rule'],
    ['non_finite', 'nan', 'non_finite', 'nan-rule'],
    ['fail', 'nan', 'fail', 'nan-rule'],
    [undefined, '********', 'non_finite', 'overflowed-field'],
    [undefined, '', 'fail', 'empty-value'],
    [undefined, 'n/a', 'fail', 'unreadable-value'],
  ] as const)('nan: %s, c = %j → %s by %s', (nanVerdict, m, verdict, decidedBy) => {
    const c = crit({ tolerance: ulps1, ...(nanVerdict ? { nan: { verdict: nanVerdict } } : {}) })
    const j = judgeCase(exactRef('1'), cell(m), c, X)
    expect(j).toEqual({ absError: null, relError: null, ulps: null, digitsAgreed: null, verdict, decidedBy, region: 'all' })
  })
})
