/**
 * Binary format helpers: values fixed by IEEE 754 (facts of the trade,
 * common practice, no source typed in beyond the format parameters of
 * IEEE 754-2019 Table 3.5), and a cross-check of binary64 rounding against
 * the ECMAScript number parser, which the language specifies to round
 * correctly (ECMA-262, Number::toString / StringToNumber).
 */
import { describe, it, expect } from 'vitest'
import { roundToFormat, ulpOf, ulpDistance, parseMeasured, roundCertifiedToFormat, fromDyadic } from '../../../shared/numeric/binary-formats'
import { randomSource, randomDecimal, TestDecimal as D } from './support'

const exact = (s: string) => new D(s)

describe('correct rounding to each format', () => {
  it.each([
    ['0.1', 'binary64', '0.1000000000000000055511151231257827021181583404541015625'],
    ['0.1', 'binary32', '0.100000001490116119384765625'],
    ['1', 'binary128', '1'],
    ['-2.5', 'binary32', '-2.5'],
    // 1 + 2^−53 is a tie: to even gives 1; 1 + 3·2^−53 goes up to 1 + 2^−51.
    ['1.00000000000000011102230246251565404236316680908203125', 'binary64', '1'],
    ['1.00000000000000033306690738754696212708950042724609375', 'binary64', '1.0000000000000004440892098500626161694526672363281250'],
  ] as const)('%s in %s is %s', (x, f, v) => {
    expect(exact(roundToFormat(x, f).decimal).eq(v)).toBe(true)
  })
  it('overflow threshold of binary64: below it the largest finite number, at or above it infinity', () => {
    const max = fromDyadic(false, (1n << 53n) - 1n, 971)
    const maxStr = `${max.coef}e${max.exp}`
    expect(exact(roundToFormat(maxStr, 'binary64').decimal).eq(exact(maxStr))).toBe(true)
    expect(roundToFormat('1.7976931348623158e308', 'binary64').kind).toBe('finite')
    expect(roundToFormat('1.7976931348623159e308', 'binary64').kind).toBe('infinity')
    expect(roundToFormat('-1e39', 'binary32')).toMatchObject({ kind: 'infinity', neg: true })
  })
  it('subnormals and underflow: half the smallest subnormal rounds to zero (tie to even), a bit more rounds up', () => {
    const tiny = fromDyadic(false, 1n, -1075) // exactly half of 2^−1074
    expect(roundToFormat(`${tiny.coef}e${tiny.exp}`, 'binary64').decimal).toBe('0')
    expect(exact(roundToFormat('3e-324', 'binary64').decimal).eq(exact(ulpOf('0', 'binary64')))).toBe(true)
  })
  it('binary64 rounding agrees with the ECMAScript parser on random decimals', () => {
    const { next } = randomSource('binary64 vs Number')
    for (let i = 0; i < 400; i++) {
      const e = Math.floor(next() * 600) - 300
      const s = `${randomDecimal(next, -10, 10, 18)}e${e}`
      const n = Number(s)
      const r = roundToFormat(s, 'binary64')
      if (n === 0) { expect(r.decimal).toBe('0'); continue }
      // Number → exact decimal via its hex bits, without trusting toString.
      const buf = new DataView(new ArrayBuffer(8))
      buf.setFloat64(0, n)
      const bits = buf.getBigUint64(0)
      const ex = Number((bits >> 52n) & 0x7ffn)
      const frac = bits & ((1n << 52n) - 1n)
      const v = ex === 0 ? fromDyadic(n < 0, frac, -1074) : fromDyadic(n < 0, frac | (1n << 52n), ex - 1075)
      expect(exact(r.decimal).eq(exact(`${v.neg ? '-' : ''}${v.coef}e${v.exp}`)), s).toBe(true)
    }
  })
})

describe('ULPs', () => {
  it.each([
    ['1', 'binary64', '2.220446049250313080847263336181640625e-16'], // 2^−52
    ['1', 'binary32', '1.1920928955078125e-7'], // 2^−23
    ['0.75', 'binary64', '1.1102230246251565404236316680908203125e-16'], // 2^−53
    ['1e400', 'binary64', '1.99584030953471981166e292'], // top binade: 2^971
  ] as const)('ulp(%s) in %s = %s', (x, f, u) => {
    expect(relDiff(ulpOf(x, f), u).lt('1e-20')).toBe(true)
  })
  it('ulp of zero is the smallest subnormal', () => {
    expect(relDiff(ulpOf('0', 'binary64'), '4.9406564584124654e-324').lt('1e-16')).toBe(true)
    expect(relDiff(ulpOf('0', 'binary128'), new D(2).pow(-16494)).lt('1e-30')).toBe(true)
  })
})

describe('ULP distance', () => {
  it('the double nearest 0.1 is 0.4 ULP from one tenth (hex float input)', () => {
    expect(ulpDistance('0x1.999999999999ap-4', '0.1', 'binary64')).toEqual({ ulps: '0.4', kind: 'finite' })
  })
  it('signed, and exact for decimal input', () => {
    expect(ulpDistance('1.0000000000000002220446049250313080847263336181640625', '1', 'binary64').ulps).toBe('1')
    expect(ulpDistance('0.99999999999999988897769753748434595763683319091796875', '1', 'binary64').ulps).toBe('-0.5')
  })
  it('infinities: agree when the reference overflows the format with the same sign', () => {
    expect(ulpDistance('inf', '1e400', 'binary64').kind).toBe('overflow-agrees')
    expect(ulpDistance('Infinity', '1e300', 'binary64')).toEqual({ ulps: 'Infinity', kind: 'infinite' })
    expect(ulpDistance('-inf', '1e400', 'binary64').ulps).toBe('-Infinity')
    expect(ulpDistance('inf', '1e300', 'binary128').kind).toBe('infinite')
  })
  it('NaN has no distance', () => {
    expect(ulpDistance('nan', '1', 'binary32')).toEqual({ ulps: null, kind: 'nan' })
    expect(parseMeasured('-NaN')).toEqual({ kind: 'nan' })
  })
})

it('a certified value whose interval straddles a rounding boundary is not settled', () => {
  // 35 digits just below the binary64 midpoint 1 + 2^−53: cannot decide.
  expect(roundCertifiedToFormat('1.0000000000000001110223024625156540e+0', 35, false, 'binary64').settled).toBe(false)
  expect(roundCertifiedToFormat('1.0000000000000001110223024625156540e+0', 35, false, 'binary32').settled).toBe(true)
})

function relDiff(a: string | InstanceType<typeof D>, b: string | InstanceType<typeof D>) {
  const x = new D(a), y = new D(b)
  return x.minus(y).abs().div(y.abs())
}
