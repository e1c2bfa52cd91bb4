/**
 * The seeded generator against the authors' reference C code (xoshiro128**
 * 1.1 and SplitMix64 from https://prng.di.unimi.it/, public domain),
 * compiled with gcc from tests/unit/grid/prng-vectors.c; the vectors below
 * are that program's output (gcc 14 on this machine). The C file also
 * prints the pinned random grid points of expand.test.ts.
 */
import { describe, expect, it } from 'vitest'
import { Xoshiro128ss, splitMix64 } from '../../../shared/grid/prng'

const draw = (g: Xoshiro128ss, n: number) => Array.from({ length: n }, () => g.next())

describe('xoshiro128** 1.1', () => {
  it('from state 1, 2, 3, 4', () => {
    expect(draw(new Xoshiro128ss([1, 2, 3, 4]), 6)).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492])
  })

  it('refuses the all-zero state', () => {
    expect(() => new Xoshiro128ss([0, 0, 0, 0])).toThrow(/all zero/)
  })

  it.each([
    [0, [3737715805, 2584255861, 2876756834, 3286328325, 1553311962, 1625202774]],
    [42, [1776835114, 4165204688, 17111135, 2317295270, 2792088233, 2554630222]],
    [20261201, [1212717254, 187102991, 2799991943, 563791004, 2310151566, 1695033977]],
    [9007199254740991, [1233166643, 1287031142, 661813442, 2960669951, 2601079046, 1036114921]],
  ])('seeded from SplitMix64(%s)', (seed, expected) => {
    expect(draw(Xoshiro128ss.fromSeed(seed), 6)).toEqual(expected)
  })
})

describe('SplitMix64', () => {
  it('seed 0, first three outputs (gcc run of the reference code)', () => {
    expect(splitMix64(0n, 3)).toEqual([16294208416658607535n, 7960286522194355700n, 487617019471545679n])
  })
})

describe('below(n): uniform integers by rejection', () => {
  it.each([1n, 2n, 51n, 2001n, 2n ** 32n, 2n ** 40n + 7n])('stays in [0, %s)', (n) => {
    const g = Xoshiro128ss.fromSeed(1)
    for (let i = 0; i < 2000; i++) {
      const v = g.below(n)
      expect(v >= 0n && v < n).toBe(true)
    }
  })

  it('covers every value of a small range about equally (6000 draws, 6 values)', () => {
    const g = Xoshiro128ss.fromSeed(99)
    const counts = [0, 0, 0, 0, 0, 0]
    for (let i = 0; i < 6000; i++) counts[Number(g.below(6n))]!++
    // Binomial(6000, 1/6): mean 1000, sd ≈ 28.9; ±150 is more than 5 sd.
    for (const c of counts) expect(Math.abs(c - 1000)).toBeLessThan(150)
  })

  it('refuses n ≤ 0', () => {
    expect(() => Xoshiro128ss.fromSeed(1).below(0n)).toThrow()
  })
})
