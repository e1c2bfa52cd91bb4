/**
 * Judging one case: a measured value against its certified reference under
 * the set's acceptance criterion.
 *
 * Guarantees:
 * - Verdicts come from exact BigInt comparisons (exact-ops.ts), never from
 *   floating point.
 * - No verdict rests on a digit the reference does not certify: when the
 *   reference is not exact, the verdict is re-derived at r ± δ (δ = half a
 *   unit of the last certified digit) whenever the case lies within reach
 *   of its bound; if the three disagree the case fails with decidedBy
 *   'unsettled' (conservative: never a pass the digits cannot prove).
 * - A measured number is first rounded to the criterion's format (ties to
 *   even): its text stands for a value of that format, and 17 significant
 *   digits are what binary64 needs to round-trip (IEEE 754-2019 §5.12.2),
 *   so a 17-digit printing is judged on the binary64 value it names. Text
 *   beyond the format's range becomes ±inf (overflow-rule).
 * - Errors are reported unsigned, to 4 significant digits (half to even,
 *   from the exact quotient), in e-notation.
 *
 * Rules outside the tolerance (all stated in the criterion or here):
 * - zero-rule: r = 0 or |r| < zero.below → |c − r| ≤ zero.atol.
 * - overflow-rule: a measured ±inf passes or fails per overflow.signedInf
 *   when r rounds to the same infinity in the format; an inf of the wrong
 *   sign fails; an inf where r is finite in the format is non_finite.
 *   A finite measured value against an overflowing r is judged by the
 *   tolerance like any other number.
 * - nan-rule: a measured NaN gets nan.verdict (non_finite by default).
 * - a field of asterisks ('overflowed') is non_finite; an empty or
 *   unreadable field fails.
 */
import { parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { roundCertifiedToFormat, roundToFormat, ulpExponent } from '../numeric/binary-formats'
import type { Criterion } from '../schemas/criterion'
import { compileCriterion, regionRule, threshold, zeroRuleApplies, type CompiledCriterion, type CompiledTolerance } from './criterion'
import { absDiff, addNear, cmpAbs, cmpNear, formatAbs, formatRatio, log10Ratio, mulExact, mulPow2, order, type Near } from './exact-ops'
import { DEFAULT_REGION } from './regions'

export interface ReferenceValue {
  /** The certified value, correctly rounded to `digits` significant digits. */
  value: string
  digits: number
  kappa: string | null
  /** True only when `value` is the exact reference value itself (no rounding). */
  exact?: boolean
}

export type MeasuredKind = 'number' | 'inf' | 'nan' | 'overflowed' | 'empty' | 'text'
export interface MeasuredValue { raw: string; kind: MeasuredKind; value?: string; sign?: 1 | -1 }

export type CaseVerdict = 'pass' | 'fail' | 'non_finite'

export interface CaseJudgement {
  absError: string | null
  relError: string | null
  ulps: string | null
  digitsAgreed: number | null
  verdict: CaseVerdict
  decidedBy: string
  region: string
}

export interface JudgeOptions {
  /** The case's stored region name; selected from the inputs when absent. */
  region?: string
}

const asCompiled = (c: Criterion | CompiledCriterion): CompiledCriterion =>
  'tolerance' in c && 'p' in c ? c : compileCriterion(c as Criterion)

function noErrors(verdict: CaseVerdict, decidedBy: string, region: string): CaseJudgement {
  return { absError: null, relError: null, ulps: null, digitsAgreed: null, verdict, decidedBy, region }
}

/** Judge one case; see the file header for the rules. Throws only on a malformed reference value. */
export function judgeCase(reference: ReferenceValue, measured: MeasuredValue, criterion: Criterion | CompiledCriterion,
  inputs: Record<string, string>, opts: JudgeOptions = {}): CaseJudgement {
  const cc = asCompiled(criterion)
  const rule = regionRule(cc, { inputs, region: opts.region })
  const region = rule.name
  switch (measured.kind) {
    case 'nan': return noErrors(cc.nanVerdict, 'nan-rule', region)
    case 'overflowed': return noErrors('non_finite', 'overflowed-field', region)
    case 'empty': return noErrors('fail', 'empty-value', region)
    case 'text': return noErrors('fail', 'unreadable-value', region)
    case 'inf': return judgeInfinity(reference, measured, cc, region)
    case 'number': break
  }
  const r = parseExactDecimal(reference.value, 'reference')
  let written: ExactDecimal
  try { written = parseExactDecimal(measured.value ?? measured.raw, 'measured') } catch { return noErrors('fail', 'unreadable-value', region) }
  // The text stands for a number of the target format: judge that number.
  const inFormat = roundToFormat(written, cc.format)
  if (inFormat.kind === 'infinity') return judgeInfinity(reference, { raw: measured.raw, kind: 'inf', sign: inFormat.neg ? -1 : 1 }, cc, region)
  const c = mulPow2({ neg: inFormat.neg, coef: inFormat.significand, exp: 0 }, inFormat.exponent)
  const diff = absDiff(c, r)
  const kappa = reference.kappa === null ? null : parseExactDecimal(reference.kappa, 'kappa')
  const errors = errorFigures(diff.v, r, reference.digits, cc)
  const at = decide(cc, rule.tolerance, c, r, kappa)
  const exactRef = reference.exact === true || r.coef === 0n
  if (!exactRef && needsEndpoints(cc, rule.tolerance, r, reference.digits, diff, at.T, kappa)) {
    const delta: ExactDecimal = { neg: false, coef: 5n, exp: order(r) - reference.digits - 1 }
    const lo = addNear(r, { ...delta, neg: !r.neg }).v
    const hi = addNear(r, { ...delta, neg: r.neg }).v
    const sign = (x: ExactDecimal): ExactDecimal => ({ ...x, neg: r.neg })
    const a = decide(cc, rule.tolerance, c, sign(lo), kappa).pass
    const b = decide(cc, rule.tolerance, c, sign(hi), kappa).pass
    if (a !== at.pass || b !== at.pass) return { ...errors, verdict: 'fail', decidedBy: 'unsettled', region }
  }
  const decidedBy = at.part === 'zero-rule' || region === DEFAULT_REGION ? at.part : `region:${region}/${at.part}`
  return { ...errors, verdict: at.pass ? 'pass' : 'fail', decidedBy, region }
}

/** Pass or fail of |c − r| against the zero rule or the region's tolerance, exactly. */
function decide(cc: CompiledCriterion, t: CompiledTolerance, c: ExactDecimal, r: ExactDecimal, kappa: ExactDecimal | null): { pass: boolean; part: string; T: Near } {
  if (zeroRuleApplies(cc, r)) {
    const T: Near = { v: cc.zeroAtol, nudge: 0 }
    return { pass: cmpNear(absDiff(c, r), T) <= 0, part: 'zero-rule', T }
  }
  const { T, part } = threshold(cc, t, r, kappa)
  return { pass: cmpNear(absDiff(c, r), T) <= 0, part, T }
}

/**
 * Whether moving r by δ could change the verdict: |c − r| moves by ≤ δ and
 * the bound by ≤ s·δ (s = rtol, or k·κ·u); ulps bounds jump at binade
 * edges and the zero rule switches at `below`, so those are checked too.
 */
function needsEndpoints(cc: CompiledCriterion, t: CompiledTolerance, r: ExactDecimal, digits: number, diff: Near, T: Near, kappa: ExactDecimal | null): boolean {
  const delta: ExactDecimal = { neg: false, coef: 5n, exp: order(r) - digits - 1 }
  const absR: ExactDecimal = { ...r, neg: false }
  const lo = addNear(absR, { ...delta, neg: true }).v
  const hi = addNear(absR, delta).v
  if (cc.zeroBelow.coef !== 0n && zeroRuleApplies(cc, lo) !== zeroRuleApplies(cc, hi)) return true
  const zero = zeroRuleApplies(cc, r)
  if (!zero && t.kind === 'ulps' && ulpExponent(lo, cc.format) !== ulpExponent(hi, cc.format)) return true
  let s: ExactDecimal | null = null
  if (!zero) {
    if (t.kind === 'relative' || t.kind === 'mixed') s = t.rtol
    else if (t.kind === 'condition') {
      const kap = kappa === null || cmpAbs(kappa, t.kappaFloor) < 0 ? t.kappaFloor : kappa
      s = mulPow2(mulExact(t.k, kap), -cc.p)
    }
  }
  const reach = s ? addNear(delta, mulExact(delta, s)) : { v: delta, nudge: 0 as const }
  const gap = absDiff(T.v, diff.v)
  return cmpNear({ v: gap.v, nudge: 0 }, { v: reach.v, nudge: 1 }) <= 0
}

/** Absolute and relative error, ULPs of the exact r in the format, and digits agreed. */
function errorFigures(d: ExactDecimal, r: ExactDecimal, digits: number, cc: CompiledCriterion): Pick<CaseJudgement, 'absError' | 'relError' | 'ulps' | 'digitsAgreed'> {
  const absError = formatAbs(d)
  const q = ulpExponent({ ...r, neg: false }, cc.format)
  const ulps = q <= 0 ? formatRatio(d.coef << BigInt(-q), 1n, d.exp) : formatRatio(d.coef, 1n << BigInt(q), d.exp)
  if (r.coef === 0n) return { absError, relError: null, ulps, digitsAgreed: d.coef === 0n ? digits : 0 }
  if (d.coef === 0n) return { absError, relError: '0', ulps, digitsAgreed: digits }
  const relError = formatRatio(d.coef, r.coef, d.exp - r.exp)
  const agreed = -log10Ratio(d.coef, r.coef, d.exp - r.exp)
  return { absError, relError, ulps, digitsAgreed: Math.round(Math.min(digits, Math.max(0, agreed)) * 100) / 100 }
}

/** A measured ±inf: agrees only with a reference that rounds to the same infinity in the format. */
function judgeInfinity(reference: ReferenceValue, measured: MeasuredValue, cc: CompiledCriterion, region: string): CaseJudgement {
  const neg = (measured.sign ?? (measured.raw.trim().startsWith('-') ? -1 : 1)) < 0
  const { rounded, settled } = roundCertifiedToFormat(reference.value, reference.digits, reference.exact === true, cc.format)
  if (!settled) return noErrors('fail', 'unsettled', region)
  if (rounded.kind === 'infinity') {
    if (rounded.neg !== neg) return noErrors('fail', 'overflow-rule', region)
    const out = noErrors(cc.signedInf, 'overflow-rule', region)
    return { ...out, ulps: '0' }
  }
  return noErrors('non_finite', 'overflow-rule', region)
}
