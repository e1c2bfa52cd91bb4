/**
 * Points of one grid part, in a stable order, with exact arithmetic:
 * range values are start + i·step computed exactly (no drift, so 0.1 steps
 * land on 0.3 and on the stop), and random values are exact lattice points
 * min + k·10^-places with k uniform from xoshiro128** (prng.ts).
 */
import { add, mul, fromBigInt, parseExactDecimal, pow10, type ExactDecimal } from '../numeric/exact'
import type { GridPart } from '../schemas/reference-set'
import { canonicalDecimal } from './keys'
import { Xoshiro128ss } from './prng'

export class GridError extends Error {
  constructor(message: string, readonly issues: GridIssue[] = []) {
    super(message)
    this.name = 'GridError'
  }
}

export interface GridIssue { part: number; point?: number; param?: string; message: string }

type Axis = { param: string; values: string[] }

/** Align two exact decimals to a common exponent: integers a, b with x = a·10^e, y = b·10^e. */
function align(x: ExactDecimal, y: ExactDecimal): [bigint, bigint] {
  const e = Math.min(x.exp, y.exp)
  const s = (v: ExactDecimal) => (v.neg ? -1n : 1n) * v.coef * pow10(v.exp - e)
  return [s(x), s(y)]
}

/** Number of values start, start + step, … ≤ stop (exact); throws GridError on a bad axis. */
export function rangeCount(part: number, param: string, start: string, stop: string, step: string): bigint {
  const a = parseExactDecimal(start, param)
  const b = parseExactDecimal(stop, param)
  const h = parseExactDecimal(step, param)
  if (h.neg || h.coef === 0n) throw new GridError(`Part ${part + 1}: the step of '${param}' must be greater than zero.`, [{ part, param, message: 'step must be > 0' }])
  const [sa, sb] = align(a, b)
  if (sb < sa) throw new GridError(`Part ${part + 1}: '${param}' starts at ${start}, after its stop ${stop}.`, [{ part, param, message: 'start > stop' }])
  const [span, st] = align(add(b, { ...a, neg: !a.neg }), h)
  return span / st + 1n
}

/** The exact values of one range axis (start + i·step, or the listed values). */
function axisValues(part: number, axis: Extract<GridPart, { kind: 'range' }>['axes'][number], cap: number): Axis {
  if ('values' in axis) return { param: axis.param, values: axis.values }
  const n = rangeCount(part, axis.param, axis.start, axis.stop, axis.step)
  if (n > BigInt(cap)) throw new GridError(`Part ${part + 1}: '${axis.param}' alone gives ${n} values, more than the limit of ${cap} cases.`, [{ part, param: axis.param, message: 'too many values' }])
  const a = parseExactDecimal(axis.start, axis.param)
  const h = parseExactDecimal(axis.step, axis.param)
  const values: string[] = []
  for (let i = 0n; i < n; i++) values.push(canonicalDecimal(add(a, mul(fromBigInt(i), h))))
  return { param: axis.param, values }
}

/** Cartesian product of a range part's axes (last axis fastest), checked against the cap before building. */
export function rangePoints(part: number, p: Extract<GridPart, { kind: 'range' }>, cap: number): Array<Record<string, string>> {
  const axes = p.axes.map(a => axisValues(part, a, cap))
  const total = axes.reduce((t, a) => t * BigInt(a.values.length), 1n)
  if (total > BigInt(cap)) throw new GridError(`Part ${part + 1}: the range gives ${total} points, more than the limit of ${cap} cases.`, [{ part, message: 'too many points' }])
  const out: Array<Record<string, string>> = []
  const idx = new Array<number>(axes.length).fill(0)
  for (let k = 0n; k < total; k++) {
    const point: Record<string, string> = {}
    axes.forEach((a, j) => { point[a.param] = a.values[idx[j]!]! })
    out.push(point)
    for (let j = axes.length - 1; j >= 0; j--) {
      if (++idx[j]! < axes[j]!.values.length) break
      idx[j] = 0
    }
  }
  return out
}

/** x as a plain decimal with exactly `places` digits after the point (x must have no more). */
export function toFixedPlaces(x: ExactDecimal, places: number): string {
  const scaled = x.coef * pow10(x.exp + places)
  const digits = scaled.toString().padStart(places + 1, '0')
  const body = places === 0 ? digits : `${digits.slice(0, digits.length - places)}.${digits.slice(digits.length - places)}`
  return (x.neg && scaled !== 0n ? '-' : '') + body
}

/** Seeded random points of a random part, in draw order (axes drawn in listed order each time). */
export function randomPoints(part: number, p: Extract<GridPart, { kind: 'random' }>): Array<Record<string, string>> {
  const axes = p.axes.map((a) => {
    const lo = parseExactDecimal(a.min, a.param)
    const hi = parseExactDecimal(a.max, a.param)
    for (const [name, v] of [['min', lo], ['max', hi]] as const) {
      if (v.coef !== 0n && v.exp < -a.places) throw new GridError(`Part ${part + 1}: ${name} of '${a.param}' has more than ${a.places} decimal places.`, [{ part, param: a.param, message: `${name} has too many places` }])
    }
    const [l, h] = [lo, hi].map(v => (v.neg ? -1n : 1n) * v.coef * pow10(v.exp + a.places)) as [bigint, bigint]
    if (h < l) throw new GridError(`Part ${part + 1}: min of '${a.param}' is above its max.`, [{ part, param: a.param, message: 'min > max' }])
    return { param: a.param, low: l, size: h - l + 1n, places: a.places }
  })
  const rng = Xoshiro128ss.fromSeed(p.seed)
  const out: Array<Record<string, string>> = []
  for (let i = 0; i < p.count; i++) {
    const point: Record<string, string> = { ...p.fixed }
    for (const a of axes) {
      const k = a.low + rng.below(a.size)
      point[a.param] = toFixedPlaces({ neg: k < 0n, coef: k < 0n ? -k : k, exp: -a.places }, a.places)
    }
    out.push(point)
  }
  return out
}
