/**
 * Region selection (first match wins, default 'all') and the expression
 * grammar. Boundary cases are exact: sqrt(2·4 + 1) = 3 and sqrt(2·12 + 1)
 * = 5, so |x| = 3 at n = 4 is not greater than the bound.
 */
import { describe, expect, it } from 'vitest'
import { judgeCase, judgeSetCase } from '../../../shared/compare/judge'
import { compileCriterion, regionOf } from '../../../shared/compare/criterion'
import { parseExpression, expressionNames } from '../../../shared/compare/expression'
import { RegionError } from '../../../shared/compare/regions'
import type { Region } from '../../../shared/schemas/criterion'
import { cell, crit, exactRef, ONE_PLUS_2ULP } from './support'

const tail: Region = { name: 'tail', when: [{ param: 'x', op: 'absGreaterThan', value: 'sqrt(2*n+1)' }], tolerance: { kind: 'ulps', maxUlps: '64' } }
const bigN: Region = { name: 'big-n', when: [{ param: 'n', op: 'atLeast', value: '100' }], tolerance: { kind: 'relative', rtol: '1e-12' } }
const c = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [bigN, tail] })

describe('first matching region wins', () => {
  it.each([
    ['4', '3', 'all'],
    ['4', '-3', 'all'],
    ['4', '3.0000000000000000000001', 'tail'],
    ['4', '2.9999999999999999999999', 'all'],
    ['4', '-3.5', 'tail'],
    ['12', '5', 'all'],
    ['12', '5.001', 'tail'],
    ['0', '1', 'all'],
    ['0', '1.0000001', 'tail'],
    ['200', '100', 'big-n'],
    ['99', '100', 'tail'],
    ['3', '1e5', 'tail'],
  ])('n = %s, x = %s → %s', (n, x, region) => {
    expect(regionOf(c, { n, x })).toBe(region)
  })
})

describe('the region decides the bound and is named in decidedBy', () => {
  it.each([
    [{ n: '4', x: '3' }, 'fail', 'ulps', 'all'],
    [{ n: '4', x: '3.5' }, 'pass', 'region:tail/ulps', 'tail'],
    [{ n: '150', x: '0.5' }, 'pass', 'region:big-n/rtol', 'big-n'],
  ])('%j → %s by %s', (inputs, verdict, decidedBy, region) => {
    const j = judgeCase(exactRef('1'), cell(ONE_PLUS_2ULP), c, inputs)
    expect([j.verdict, j.decidedBy, j.region]).toEqual([verdict, decidedBy, region])
  })

  it('uses a stored region name without re-evaluating the inputs', () => {
    expect(judgeCase(exactRef('1'), cell(ONE_PLUS_2ULP), c, { n: '4', x: '3' }, { region: 'tail' }).decidedBy).toBe('region:tail/ulps')
  })

  it('reads a set case\'s inputs only when its stored region is not one of the criterion\'s', () => {
    const cc = compileCriterion(c)
    let reads = 0
    const setCase = (region: string) => ({ reference: exactRef('1'), region, get inputs() { reads++; return { n: '4', x: '3.5' } } })
    expect(judgeSetCase(setCase('tail'), cell(ONE_PLUS_2ULP), cc).decidedBy).toBe('region:tail/ulps')
    expect(reads).toBe(0)
    // a region name the criterion no longer has: worked out again from the inputs
    expect(judgeSetCase(setCase('gone'), cell(ONE_PLUS_2ULP), cc).region).toBe('tail')
    expect(reads).toBe(1)
  })
})

describe('conditions', () => {
  it.each([
    ['lessThan', '2', '1', true], ['lessThan', '2', '2', false],
    ['atMost', '2', '2', true], ['greaterThan', '2', '2', false],
    ['atLeast', '2', '2', true], ['equals', '0.5', '0.50', true],
    ['notEquals', '0.5', '0.5', false], ['notEquals', '0.5', '0.6', true],
    ['absLessThan', '2', '-1.5', true], ['absAtMost', '2', '-2', true],
    ['absAtLeast', '2', '-1.999', false], ['equals', '1/3', '0.333333333333333333', false],
    ['lessThan', 'x/2 + abs(-1) - (x - 1)', '0.9', true], ['lessThan', 'x/2 + abs(-1) - (x - 1)', '1.4', false],
  ] as const)('x %s %s at x = %s → %s', (op, value, x, expected) => {
    const cc = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'r', when: [{ param: 'x', op, value }], tolerance: { kind: 'ulps', maxUlps: '2' } }] })
    expect(regionOf(cc, { n: '1', x })).toBe(expected ? 'r' : 'all')
  })

  it('all conditions of a region must hold (AND)', () => {
    const cc = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'band', when: [{ param: 'x', op: 'atLeast', value: '1' }, { param: 'x', op: 'lessThan', value: '2' }], tolerance: { kind: 'ulps', maxUlps: '2' } }] })
    expect(['0.5', '1', '1.5', '2'].map(x => regionOf(cc, { n: '1', x }))).toEqual(['all', 'band', 'band', 'all'])
  })

  it('compares a choice parameter as text', () => {
    const cc = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'prob', when: [{ param: 'weight', op: 'equals', value: 'probabilists' }], tolerance: { kind: 'ulps', maxUlps: '8' } }] })
    expect(regionOf(cc, { n: '5', i: '1', weight: 'probabilists' })).toBe('prob')
    expect(regionOf(cc, { n: '5', i: '1', weight: 'physicists' })).toBe('all')
  })

  it('reports division by zero and sqrt of a negative with the case', () => {
    const div = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'r', when: [{ param: 'x', op: 'lessThan', value: '1/n' }], tolerance: { kind: 'ulps', maxUlps: '2' } }] })
    expect(() => regionOf(div, { n: '0', x: '1' })).toThrow(RegionError)
    expect(() => regionOf(div, { n: '0', x: '1' })).toThrow(/division by zero at n=0, x=1/)
    const neg = crit({ tolerance: { kind: 'ulps', maxUlps: '1' }, regions: [{ name: 'r', when: [{ param: 'x', op: 'lessThan', value: 'sqrt(n - 5)' }], tolerance: { kind: 'ulps', maxUlps: '2' } }] })
    expect(() => regionOf(neg, { n: '1', x: '1' })).toThrow(/sqrt of a negative number/)
  })
})

describe('expression grammar', () => {
  it.each([
    ['sqrt(2*n+1)', ['n']], ['-x + 2.5e-3*nu', ['x', 'nu']], ['abs((a - b) / z)', ['a', 'b', 'z']], ['42', []],
  ])('%s uses %j', (text, names) => {
    expect(expressionNames(parseExpression(text))).toEqual(names)
  })

  it.each([
    ['2n', /Unexpected 'n' at column 2/],
    ['sqrt(2*n+1', /Expected '\)' at the end/],
    ['1 +', /Expected a number, a parameter or \( at the end/],
    ['x; y', /Unexpected character ';' at column 2/],
    ['eval(1)', /Unexpected '\('/],
    ['process.exit()', /Unexpected character '\.'/],
    ['2 ** 3', /Unexpected '\*'/],
    ['', /Enter a value/],
  ])('refuses %j', (text, msg) => {
    expect(() => parseExpression(text)).toThrow(msg)
  })
})
