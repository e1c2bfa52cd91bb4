/** Small BigInt helpers shared by the fixed-point cores. */

/** Number of bits of |v| (0 for 0). */
export function bitLength(v: bigint): number {
  if (v < 0n) v = -v
  if (v === 0n) return 0
  const hex = v.toString(16)
  return (hex.length - 1) * 4 + (32 - Math.clz32(parseInt(hex[0]!, 16)))
}

/** log2 |v| as a double, good to ~1e-12 (for estimates, never for bounds). */
export function log2Abs(v: bigint): number {
  if (v < 0n) v = -v
  if (v === 0n) return -Infinity
  const bl = bitLength(v)
  if (bl <= 1000) return Math.log2(Number(v))
  return Math.log2(Number(v >> BigInt(bl - 60))) + (bl - 60)
}

/**
 * An integer upper bound ≥ 2^l2 (l2 a log2 value from a double computation).
 * The mantissa is rounded up, so the result never undershoots.
 */
export function ceilPow2(l2: number): bigint {
  if (l2 === -Infinity) return 0n
  if (l2 < 0) return 1n
  const ip = Math.floor(l2)
  if (ip < 52) return BigInt(Math.ceil(2 ** l2)) + 1n
  const mant = BigInt(Math.ceil(2 ** (l2 - ip + 52))) + 1n
  return mant << BigInt(ip - 52)
}

const FACT: bigint[] = [1n]
export function factorial(n: number): bigint {
  while (FACT.length <= n) FACT.push(FACT[FACT.length - 1]! * BigInt(FACT.length))
  return FACT[n]!
}

/** log2(2^a + 2^b) for doubles in log2 form. */
export function log2Add(a: number, b: number): number {
  if (a === -Infinity) return b
  if (b === -Infinity) return a
  const m = Math.max(a, b)
  return m + Math.log2(2 ** (a - m) + 2 ** (b - m))
}
