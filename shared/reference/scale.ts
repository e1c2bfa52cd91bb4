/** Multiplying a fixed-point enclosure by an exact decimal. */
import { pow10, type ExactDecimal } from '../numeric/exact'
import { log2Add } from '../numeric/bits'

const LOG2_10 = Math.log2(10)

/**
 * (M ± R)·2^−F times x exactly = M'·2^−F' with radius R': for x = c·10^e,
 * e < 0, the quotient by 10^−e is floored (one more unit of error).
 */
export function scaleByExact(M: bigint, log2R: number, F: number, x: ExactDecimal): { M: bigint; log2R: number; F: number } {
  if (x.coef === 0n) return { M: 0n, log2R: -Infinity, F }
  const c = x.neg ? -x.coef : x.coef
  const lc = Math.log2(Number(x.coef))
  if (x.exp >= 0) {
    const f = c * pow10(x.exp)
    return { M: M * f, log2R: log2R + lc + x.exp * LOG2_10 + 1e-12, F }
  }
  const G = Math.ceil(-x.exp * LOG2_10) + 8
  const den = pow10(-x.exp)
  const M2 = (M * c << BigInt(G)) / den
  const exact = log2R === -Infinity && (M2 * den === (M * c << BigInt(G)))
  const lr = log2R + lc + G - (-x.exp) * LOG2_10 + 1e-12
  return { M: M2, log2R: exact ? -Infinity : log2Add(lr, 0), F: F + G }
}
