/**
 * Each criterion kind at and around its bound, with exact references.
 * Values are dyadic (exact in binary64), so rounding the measured text to
 * the format changes nothing and the bound is hit exactly. Unit roundoff
 * u = 2^-53 and ulp(1) = 2^-52 for binary64: IEEE 754-2019 Table 3.5
 * (p = 53) and Higham, "Accuracy and Stability of Numerical Algorithms",
 * 2nd ed., §2.1 (u = 2^-p). Condition scaling k·κ·u: Higham §1.6 (forward
 * error ≲ condition number × backward error); the κ floor is our rule.
 */
import { describe, expect, it } from 'vitest'
import { judgeCase } from '../../../shared/compare/judge'
import type { Tolerance } from '../../../shared/schemas/criterion'
import { cell, crit, exactRef, ONE_PLUS_2ULP, ONE_PLUS_ULP } from './support'

const X = { n: '1', x: '0.5' }

describe.each<[string, Tolerance, Array<[string, string, string | null, 'pass' | 'fail', string]>]>([
  ['absolute', { kind: 'absolute', atol: '0.5' }, [
    ['1', '1.5', null, 'pass', 'atol'],
    ['1', '0.5', null, 'pass', 'atol'],
    ['1', '1.5000000000000002', null, 'fail', 'atol'],
    ['-1', '-1.25', null, 'pass', 'atol'],
    ['1e-30', '0.25', null, 'pass', 'atol'],
  ]],
  ['relative', { kind: 'relative', rtol: '0.25' }, [
    ['4', '5', null, 'pass', 'rtol'],
    ['4', '3', null, 'pass', 'rtol'],
    ['4', '5.0000000000000009', null, 'fail', 'rtol'],
    ['-8', '-10', null, 'pass', 'rtol'],
    ['-8', '10', null, 'fail', 'rtol'],
  ]],
  ['mixed', { kind: 'mixed', atol: '0.5', rtol: '0.25' }, [
    ['4', '5.5', null, 'pass', 'atol+rtol'],
    ['4', '5.50000000000000088', null, 'fail', 'atol+rtol'],
    ['0.5', '1.125', null, 'pass', 'atol+rtol'],
  ]],
  ['ulps', { kind: 'ulps', maxUlps: '1' }, [
    ['1', ONE_PLUS_ULP, null, 'pass', 'ulps'],
    ['1', ONE_PLUS_2ULP, null, 'fail', 'ulps'],
    // Units are ulp(r) = ulp(1) = 2^-52 on both sides of r: 1 − 2^-52 is one
    // ulp away (pass), 1 − 3·2^-53 one and a half (fail).
    ['1', '0.9999999999999997779553950749686919152736663818359375', null, 'pass', 'ulps'],
    ['1', '0.99999999999999966693309261245303787291049957275390625', null, 'fail', 'ulps'],
    ['-1', '-' + ONE_PLUS_ULP, null, 'pass', 'ulps'],
  ]],
  ['condition', { kind: 'condition', k: '1', kappaFloor: '1' }, [
    // T = k·max(κ, 1)·2^-53·|r|.
    ['1', ONE_PLUS_ULP, '2', 'pass', 'kappa'],
    ['1', ONE_PLUS_ULP, '1.999', 'fail', 'kappa'],
    ['1', ONE_PLUS_2ULP, '4', 'pass', 'kappa'],
    ['1', ONE_PLUS_ULP, '0.5', 'fail', 'kappa-floor'],
    ['1', ONE_PLUS_ULP, null, 'fail', 'kappa-floor'],
    ['1', '1', null, 'pass', 'kappa-floor'],
  ]],
])('%s', (_kind, tolerance, rows) => {
  const c = crit({ tolerance })
  it.each(rows)('r = %s, c = %s, κ = %s → %s by %s', (r, m, kappa, verdict, decidedBy) => {
    const j = judgeCase(exactRef(r, kappa), cell(m), c, X)
    expect([j.verdict, j.decidedBy, j.region]).toEqual([verdict, decidedBy, 'all'])
  })
})

describe('condition-scaled bound with k = 2 passes twice the error', () => {
  it.each([
    ['2', '1', ONE_PLUS_ULP, 'pass'],
    ['2', '1', ONE_PLUS_2ULP, 'fail'],
    ['1.5', '1', ONE_PLUS_ULP, 'fail'],
  ])('k = %s, κ = %s, c = %s → %s', (k, kappa, m, verdict) => {
    expect(judgeCase(exactRef('1', kappa), cell(m), crit({ tolerance: { kind: 'condition', k, kappaFloor: '1' } }), X).verdict).toBe(verdict)
  })
})

describe('ulps in other formats', () => {
  it.each([
    // binary32: ulp(1) = 2^-23 above 1; binary128: 2^-112 (IEEE 754-2019 Table 3.5).
    ['binary32', '1.00000011920928955078125', 'pass'],
    ['binary32', '1.0000002384185791015625', 'fail'],
    ['binary128', '1.000000000000000000000000000000000192592994438723585305597794258492732', 'pass'],
    ['binary128', '1.0000000000000000000000000000000003851859888774471706111955885169854637', 'fail'],
  ] as const)('%s, c = %s → %s', (format, m, verdict) => {
    expect(judgeCase(exactRef('1'), cell(m), crit({ format, tolerance: { kind: 'ulps', maxUlps: '1' } }), X).verdict).toBe(verdict)
  })
})

describe('the measured text is judged as the binary64 number it names', () => {
  // 22591.000000000004 (17 digits) names 22591 + 2^-38, one ulp above 22591
  // (CPython 3: Fraction(float(text)) − 22591 = 2^-38, checked when writing).
  it('17-digit printing of a value one ulp away is exactly one ulp', () => {
    const j = judgeCase(exactRef('22591'), cell('22591.000000000004'), crit({ tolerance: { kind: 'ulps', maxUlps: '1' } }), X)
    expect([j.verdict, j.ulps, j.absError]).toEqual(['pass', '1.000e+0', '3.638e-12'])
  })
})
