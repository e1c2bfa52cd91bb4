/**
 * Region selection: which named region of the criterion a case falls in.
 * Regions are tried in order; the first whose conditions all hold wins,
 * otherwise the case is in the default region 'all'.
 *
 * Method: each comparison is first tried in binary64 interval arithmetic
 * (every operation widened outward by 2^-51 relative plus the smallest
 * subnormal, which covers the rounding of each step and of reading the
 * decimal inputs). When the intervals overlap, it is settled in decimal.js
 * at 60 digits; values within 10^-55 relative of each other count as equal
 * there (so x = 3 and sqrt(2*4+1) are equal, as they are exactly).
 */
import { decimalClone } from '../numeric/decimal'
import type { Region, RegionCondition, ConditionOp } from '../schemas/criterion'
import { parseExpression, type Expr } from './expression'

export const DEFAULT_REGION = 'all'

export class RegionError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'RegionError'
  }
}

interface CompiledCondition { param: string; op: ConditionOp; expr: Expr; text: string }
export interface CompiledRegion<T> { name: string; conditions: CompiledCondition[]; payload: T }

/** Parse the conditions of each region once. */
export function compileRegions<T>(regions: Region[], payload: (r: Region) => T): Array<CompiledRegion<T>> {
  return regions.map(r => ({
    name: r.name,
    payload: payload(r),
    conditions: r.when.map((c: RegionCondition) => ({ param: c.param, op: c.op, expr: parseExpression(c.value), text: c.value })),
  }))
}

/** The first region whose conditions all hold for these inputs, or null (the default region). */
export function selectRegion<T>(regions: Array<CompiledRegion<T>>, inputs: Record<string, string>): CompiledRegion<T> | null {
  for (const r of regions) {
    if (r.conditions.every(c => holds(c, inputs, r.name))) return r
  }
  return null
}

type Iv = [number, number]
const EPS = 2 ** -51
const TINY = 5e-324

/** Widen [lo, hi] outward by one rounding step; null when not finite (fall back to decimal). */
function widen(lo: number, hi: number): Iv | null {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return null
  return [lo - Math.abs(lo) * EPS - TINY, hi + Math.abs(hi) * EPS + TINY]
}

/** An interval that surely holds the expression's value; null when the intervals cannot say. */
function ivEval(e: Expr, vars: Record<string, string>): Iv | null {
  switch (e.t) {
    case 'num': { const v = Number(e.text); return widen(v, v) }
    case 'var': {
      const s = vars[e.name]
      if (s === undefined) return null
      const v = Number(s)
      return Number.isNaN(v) ? null : widen(v, v)
    }
    case 'neg': { const a = ivEval(e.a, vars); return a && [-a[1], -a[0]] }
    case 'fn': {
      const a = ivEval(e.a, vars)
      if (!a) return null
      if (e.fn === 'abs') return a[0] >= 0 ? a : a[1] <= 0 ? [-a[1], -a[0]] : [0, Math.max(-a[0], a[1])]
      if (a[0] < 0) return null
      return widen(Math.sqrt(a[0]), Math.sqrt(a[1]))
    }
    case 'bin': {
      const a = ivEval(e.a, vars)
      const b = ivEval(e.b, vars)
      if (!a || !b) return null
      if (e.op === '+') return widen(a[0] + b[0], a[1] + b[1])
      if (e.op === '-') return widen(a[0] - b[1], a[1] - b[0])
      if (e.op === '/' && b[0] <= 0 && b[1] >= 0) return null
      const p = e.op === '*'
        ? [a[0] * b[0], a[0] * b[1], a[1] * b[0], a[1] * b[1]]
        : [a[0] / b[0], a[0] / b[1], a[1] / b[0], a[1] / b[1]]
      return widen(Math.min(...p), Math.max(...p))
    }
  }
}

const D60 = decimalClone(60)
type Dec = InstanceType<typeof D60>

/** The expression at 60 digits (each step correctly rounded); throws RegionError on division by zero or sqrt of a negative. */
function decEval(e: Expr, vars: Record<string, string>, region: string): Dec {
  switch (e.t) {
    case 'num': return new D60(e.text)
    case 'var': {
      const s = vars[e.name]
      if (s === undefined) throw new RegionError(`Region '${region}': the case has no parameter '${e.name}'.`)
      return new D60(s.trim())
    }
    case 'neg': return decEval(e.a, vars, region).neg()
    case 'fn': {
      const a = decEval(e.a, vars, region)
      if (e.fn === 'abs') return a.abs()
      if (a.isNeg() && !a.isZero()) throw new RegionError(`Region '${region}': sqrt of a negative number at ${describe(vars)}.`)
      return a.sqrt()
    }
    case 'bin': {
      const a = decEval(e.a, vars, region)
      const b = decEval(e.b, vars, region)
      if (e.op === '+') return a.plus(b)
      if (e.op === '-') return a.minus(b)
      if (e.op === '*') return a.times(b)
      if (b.isZero()) throw new RegionError(`Region '${region}': division by zero at ${describe(vars)}.`)
      return a.div(b)
    }
  }
}

/** The case's inputs for a message: n=4, x=3. */
const describe = (vars: Record<string, string>) => Object.entries(vars).map(([k, v]) => `${k}=${v}`).join(', ')

/** −1, 0, 1 for lhs <, =, > rhs; null when the intervals cannot tell. */
function ivCompare(l: Iv, r: Iv): -1 | 1 | null {
  if (l[1] < r[0]) return -1
  if (l[0] > r[1]) return 1
  return null
}

const ABS_OPS = new Set<ConditionOp>(['absLessThan', 'absAtMost', 'absGreaterThan', 'absAtLeast'])

/** The condition's truth from the sign of lhs − rhs. */
function fromSign(op: ConditionOp, s: -1 | 0 | 1): boolean {
  switch (op) {
    case 'lessThan': case 'absLessThan': return s < 0
    case 'atMost': case 'absAtMost': return s <= 0
    case 'greaterThan': case 'absGreaterThan': return s > 0
    case 'atLeast': case 'absAtLeast': return s >= 0
    case 'equals': return s === 0
    case 'notEquals': return s !== 0
  }
}

/** Whether one condition holds for the inputs: intervals first, decimal when they overlap. */
function holds(c: CompiledCondition, inputs: Record<string, string>, region: string): boolean {
  const raw = inputs[c.param]
  if (raw === undefined) throw new RegionError(`Region '${region}': the case has no parameter '${c.param}'.`)
  // A choice parameter (e.g. weight) compares as text, with equals/notEquals only.
  if (!/^\s*[+-]?(\d|\.\d)/.test(raw)) {
    if (c.op !== 'equals' && c.op !== 'notEquals') throw new RegionError(`Region '${region}': '${c.param}' is not numeric; use equals or notEquals.`)
    return (raw.trim() === c.text) === (c.op === 'equals')
  }
  const abs = ABS_OPS.has(c.op)
  const lv = Number(raw)
  const lIv = widen(abs ? Math.abs(lv) : lv, abs ? Math.abs(lv) : lv)
  const rIv = ivEval(c.expr, inputs)
  if (lIv && rIv && c.op !== 'equals' && c.op !== 'notEquals') {
    const s = ivCompare(lIv, rIv)
    if (s !== null) return fromSign(c.op, s)
  }
  if (lIv && rIv && ivCompare(lIv, rIv) !== null) return c.op === 'notEquals'
  let l = new D60(raw.trim())
  if (abs) l = l.abs()
  const r = decEval(c.expr, inputs, region)
  const d = l.minus(r)
  const scale = D60.max(l.abs(), r.abs())
  const s: -1 | 0 | 1 = d.abs().lte(scale.times('1e-55')) ? 0 : d.isNeg() ? -1 : 1
  return fromSign(c.op, s)
}
