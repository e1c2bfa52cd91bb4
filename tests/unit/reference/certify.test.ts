/**
 * The certification rules themselves: an enclosure yields only digits that
 * every point in it shares, and exact inputs are read exactly.
 */
import { describe, it, expect } from 'vitest'
import { roundFixedBall, roundFixedFast, roundDecimalBall, roundExact } from '../../../shared/reference/certify'
import { parseExactDecimal, toFixedPoint } from '../../../shared/numeric/exact'
import { TestDecimal as D } from './support'

const F = 200
const fixed = (s: string) => toFixedPoint(parseExactDecimal(s), F).v

describe('roundFixedBall', () => {
  it.each([
    ['3.14159265358979', 10, '3.141592654e+0'],
    ['-0.000123456789', 6, '-1.23457e-4'],
    ['99999.99999999', 5, '1.0000e+5'],
  ] as const)('%s to %i digits is %s', (x, d, v) => {
    expect(roundFixedBall(fixed(x), 4n, F, d)).toMatchObject({ value: v, digits: d })
  })
  it('drops digits when the enclosure straddles a rounding boundary', () => {
    // 1.25 ± 2^-40 sits on the 2-digit tie 1.25: only one digit is safe
    expect(roundFixedBall(fixed('1.25'), 1n << BigInt(F - 40), F, 3)).toMatchObject({ value: '1.25e+0', digits: 3 })
    expect(roundFixedBall(fixed('1.25'), 1n << BigInt(F - 40), F, 2)).toMatchObject({ value: '1e+0', digits: 1 })
  })
  it('gives no digits when the sign is unknown, and exact zero only for a zero enclosure', () => {
    expect(roundFixedBall(5n, 10n, F, 5).digits).toBe(0)
    expect(roundFixedBall(0n, 0n, F, 5)).toEqual({ value: '0', digits: 5, exact: true })
  })
  it('the fast path agrees with the careful one on random enclosures', () => {
    let s = 12345n
    for (let i = 0; i < 500; i++) {
      s = (s * 6364136223846793005n + 1442695040888963407n) % (1n << 300n)
      const M = (s >> BigInt(i % 120)) * (i % 2 ? -1n : 1n)
      const l2R = (i % 37) + 0.5
      const fast = roundFixedFast(M, l2R, F, 1 + (i % 60))
      const R = BigInt(Math.ceil(2 ** l2R)) + 1n
      const slow = roundFixedBall(M, R, F, 1 + (i % 60))
      if (fast.digits === slow.digits) expect(fast.value).toBe(slow.value)
      else expect(fast.digits).toBeLessThanOrEqual(1 + (i % 60))
    }
  })
})

describe('roundDecimalBall and roundExact', () => {
  it('rounds a Decimal enclosure only as far as it is certain', () => {
    expect(roundDecimalBall(new D('2.718281828459045'), 1e-12, 20).digits).toBe(12)
    expect(roundDecimalBall(new D('-6.02214076e23'), 1e-30, 9)).toMatchObject({ value: '-6.02214076e+23', digits: 9 })
  })
  it('roundExact pads short exact values and rounds long ones half away from zero', () => {
    expect(roundExact(true, 25n, -1, 4)).toEqual({ value: '-2.500e+0', digits: 4, exact: true })
    expect(roundExact(false, 125n, 0, 2)).toEqual({ value: '1.3e+2', digits: 2, exact: true })
    expect(roundExact(false, 9995n, -4, 3)).toEqual({ value: '1.00e+0', digits: 3, exact: true })
  })
})

describe('exact decimal input', () => {
  it.each([['0.1', 1n, -1], ['-12.500e3', -125n, 2], ['.5', 5n, -1], ['7E-400', 7n, -400]] as const)('%s', (s, c, e) => {
    const x = parseExactDecimal(s)
    expect((x.neg ? -1n : 1n) * x.coef).toBe(c)
    expect(x.exp).toBe(e)
  })
  it.each(['', '1.2.3', '0x10', 'NaN', 'inf', '1e', '--1', '1,5'])('rejects %j', (s) => {
    expect(() => parseExactDecimal(s, 'x')).toThrow(/x: .* is not a decimal number/)
  })
})
