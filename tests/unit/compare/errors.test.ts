/**
 * Reported errors: absolute, relative, ULPs and digits agreed, to 4
 * significant digits (half to even on the exact quotient).
 * Expected figures from CPython 3 (fractions.Fraction on float(text), which
 * is correctly rounded, and the gap definition of ulp), computed when the
 * table was written; ULPs cross-checked against the engine's independent
 * ulpDistance (shared/numeric/binary-formats.ts).
 */
import { describe, expect, it } from 'vitest'
import { judgeCase } from '../../../shared/compare/judge'
import { formatRatio } from '../../../shared/compare/exact-ops'
import { roundToFormat, ulpDistance } from '../../../shared/numeric/binary-formats'
import { cell, crit, exactRef } from './support'

const c = crit({ tolerance: { kind: 'relative', rtol: '1e-6' } })

describe('error figures against CPython', () => {
  it.each([
    // r, c, abs, rel, ulps, digits agreed (CPython: 15.79, 16.26, 16.41, 14.17, 16.28, 16.17)
    ['22591', '22591.000000000004', '3.638e-12', '1.610e-16', '1.000e+0', 15.79],
    ['0.1', '0.1', '5.551e-18', '5.551e-17', '4.000e-1', 16.26],
    ['3.14159265358979323846', '3.141592653589793', '1.225e-16', '3.898e-17', '2.758e-1', 16.41],
    ['-2.5e-310', '-2.4999999999999995e-310', '1.707e-324', '6.826e-15', '3.454e-1', 14.17],
    ['1e300', '1.0000000000000001e300', '5.250e+283', '5.250e-17', '3.531e-1', 16.28],
    ['7.0710678118654752440e-1', '0.7071067811865476', '4.834e-17', '6.836e-17', '4.354e-1', 16.17],
  ])('r = %s, c = %s', (r, m, abs, rel, ulps, agreed) => {
    const j = judgeCase(exactRef(r), cell(m), c, {})
    expect([j.absError, j.relError, j.ulps, j.digitsAgreed]).toEqual([abs, rel, ulps, agreed])
    const d = ulpDistance(roundToFormat(m, 'binary64').decimal, r, 'binary64')
    expect(Math.abs(Number(d.ulps!)).toExponential(3)).toBe(Number(ulps).toExponential(3))
  })

  it('digits agreed are clipped to the certified digits', () => {
    expect(judgeCase({ value: '0.5', digits: 17, kappa: null }, cell('0.5'), c, {}).digitsAgreed).toBe(17)
    expect(judgeCase({ value: '1.0000000000000000000', digits: 20, kappa: null }, cell('1e-30'), c, {}).digitsAgreed).toBe(0)
  })
})

describe('formatRatio rounds half to even on the exact ratio', () => {
  it.each([
    [12345n, 1n, 0, '1.234e+4'],
    [12355n, 1n, 0, '1.236e+4'],
    [123451n, 1n, 0, '1.235e+5'],
    [99995n, 1n, 0, '1.000e+5'],
    [99994n, 1n, -20, '9.999e-16'],
    [1n, 3n, 0, '3.333e-1'],
    [2n, 3n, 0, '6.667e-1'],
    [1n, 1n, 0, '1.000e+0'],
    [0n, 7n, 5, '0'],
    [5n, 1n, -324, '5.000e-324'],
  ])('%s / %s · 10^%i → %s', (num, den, e, text) => {
    expect(formatRatio(num, den, e)).toBe(text)
  })
})
