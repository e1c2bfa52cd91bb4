/**
 * The seeded generator for random grid points: xoshiro128** 1.1 by
 * Blackman and Vigna (public domain, https://prng.di.unimi.it/), seeded
 * from SplitMix64 as its authors recommend. Integer-only (Math.imul and
 * unsigned shifts, BigInt for the 64-bit seeding), so a seed gives the same
 * stream on every machine and engine. Checked against the authors' C code
 * compiled with gcc (tests/unit/grid/prng-vectors.c).
 */

const M64 = (1n << 64n) - 1n

/** SplitMix64 outputs from a 64-bit seed (the authors' splitmix64.c). */
export function splitMix64(seed: bigint, count: number): bigint[] {
  let x = seed & M64
  const out: bigint[] = []
  for (let i = 0; i < count; i++) {
    x = (x + 0x9e3779b97f4a7c15n) & M64
    let z = x
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & M64
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & M64
    out.push(z ^ (z >> 31n))
  }
  return out
}

const rotl = (x: number, k: number) => ((x << k) | (x >>> (32 - k))) >>> 0

export class Xoshiro128ss {
  private s: Uint32Array

  /** State words s[0..3] directly (must not be all zero). */
  constructor(state: readonly [number, number, number, number]) {
    if (state.every(w => (w >>> 0) === 0)) throw new Error('xoshiro128** state must not be all zero')
    this.s = Uint32Array.from(state.map(w => w >>> 0))
  }

  /** Seeded from SplitMix64(seed): s[0], s[1] = low, high word of the first output; s[2], s[3] of the second. */
  static fromSeed(seed: number | bigint): Xoshiro128ss {
    const [a, b] = splitMix64(BigInt(seed), 2) as [bigint, bigint]
    const w = (v: bigint, hi: boolean) => Number((hi ? v >> 32n : v) & 0xffffffffn)
    return new Xoshiro128ss([w(a, false), w(a, true), w(b, false), w(b, true)])
  }

  /** The next 32-bit output, as an unsigned integer. */
  next(): number {
    const s = this.s
    const result = Math.imul(rotl(Math.imul(s[1]!, 5) >>> 0, 7), 9) >>> 0
    const t = (s[1]! << 9) >>> 0
    s[2]! ^= s[0]!
    s[3]! ^= s[1]!
    s[1]! ^= s[2]!
    s[0]! ^= s[3]!
    s[2]! ^= t
    s[3] = rotl(s[3]!, 11)
    return result
  }

  /**
   * A uniform integer in [0, n), exactly: draw ⌈log2 n⌉ bits from 32-bit
   * outputs (high words first) and reject values ≥ n.
   */
  below(n: bigint): bigint {
    if (n <= 0n) throw new Error('below(n) needs n ≥ 1')
    if (n === 1n) return 0n
    const bits = (n - 1n).toString(2).length
    const words = Math.ceil(bits / 32)
    const extra = BigInt(words * 32 - bits)
    for (;;) {
      let v = 0n
      for (let i = 0; i < words; i++) v = (v << 32n) | BigInt(this.next())
      v >>= extra
      if (v < n) return v
    }
  }
}
