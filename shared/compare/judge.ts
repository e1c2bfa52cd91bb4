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
import { DomainError, type ExactDecimal } from '../numeric/exact'
import { roundCertifiedToFormat } from '../numeric/binary-formats'
import { toFormat, ulpExp } from './binary'
import type { Criterion } from '../schemas/criterion'
import { compileCriterion, regionRule, threshold, zeroRuleApplies, type CompiledCriterion, type CompiledTolerance } from './criterion'
import { absDiff, addNear, cmpAbs, cmpNear, formatAbs, formatRatio, log10Big, log10Ratio, mulExact, mulPow2, order, parseDecimal, type Near } from './exact-ops'
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

/** Accept a parsed or an already compiled criterion. */
const asCompiled = (c: Criterion | CompiledCriterion): CompiledCriterion =>
  'tolerance' in c && 'p' in c ? c : compileCriterion(c as Criterion)

/** A verdict without error figures (non-numeric cells, infinities). */
function noErrors(verdict: CaseVerdict, decidedBy: string, region: string): CaseJudgement {
  return { absError: null, relError: null, ulps: null, digitsAgreed: null, verdict, decidedBy, region }
}

/** Judge one case; see the file header for the rules. Throws only on a malformed reference value. */
export function judgeCase(reference: ReferenceValue, measured: MeasuredValue, criterion: Criterion | CompiledCriterion,
  inputs: Record<string, string>, opts: JudgeOptions = {}): CaseJudgement {
  const cc = asCompiled(criterion)
  return judgeUnderRule(reference, measured, cc, regionRule(cc, { inputs, region: opts.region }))
}

/**
 * Judge one case of a set: like judgeCase, but `inputs` is read only when
 * the stored region is not one of the criterion's (so it may be a getter).
 */
export function judgeSetCase(cs: { reference: ReferenceValue; inputs: Record<string, string>; region?: string }, measured: MeasuredValue, cc: CompiledCriterion): CaseJudgement {
  return judgeUnderRule(cs.reference, measured, cc, regionRule(cc, cs))
}

function judgeUnderRule(reference: ReferenceValue, measured: MeasuredValue, cc: CompiledCriterion, rule: { name: string; tolerance: CompiledTolerance }): CaseJudgement {
  const region = rule.name
  switch (measured.kind) {
    case 'nan': return noErrors(cc.nanVerdict, 'nan-rule', region)
    case 'overflowed': return noErrors('non_finite', 'overflowed-field', region)
    case 'empty': return noErrors('fail', 'empty-value', region)
    case 'text': return noErrors('fail', 'unreadable-value', region)
    case 'inf': return judgeInfinity(reference, measured, cc, region)
    case 'number': break
  }
  const r = parseDecimal(reference.value)
  if (r === null) throw new DomainError(`reference: '${reference.value}' is not a decimal number`, 'reference')
  // The text stands for a number of the target format: judge that number.
  const inFormat = toFormat(measured.value ?? measured.raw, cc.format)
  if (inFormat === null) return noErrors('fail', 'unreadable-value', region)
  if (inFormat.inf) return judgeInfinity(reference, { raw: measured.raw, kind: 'inf', sign: inFormat.neg ? -1 : 1 }, cc, region)
  const c = inFormat.value
  const diff = absDiff(c, r)
  const kappa = reference.kappa === null || rule.tolerance.kind !== 'condition' ? null : parseDecimal(reference.kappa)
  const errors = errorFigures(diff.v, r, reference.digits, cc)
  const at = decide(cc, rule.tolerance, c, r, kappa, diff)
  const exactRef = reference.exact === true || r.coef === 0n
  if (!exactRef && needsEndpoints(cc, rule.tolerance, r, reference.digits, diff, at.T, kappa)) {
    const delta: ExactDecimal = { neg: r.neg, coef: 5n, exp: order(r) - reference.digits - 1 }
    const lo = addNear(r, { neg: !r.neg, coef: 5n, exp: delta.exp }).v
    const hi = addNear(r, delta).v
    const a = decide(cc, rule.tolerance, c, lo, kappa).pass
    const b = decide(cc, rule.tolerance, c, hi, kappa).pass
    if (a !== at.pass || b !== at.pass) return withVerdict(errors, 'fail', 'unsettled', region)
  }
  const decidedBy = at.part === 'zero-rule' || region === DEFAULT_REGION ? at.part : `region:${region}/${at.part}`
  return withVerdict(errors, at.pass ? 'pass' : 'fail', decidedBy, region)
}

type ErrorFigures = Pick<CaseJudgement, 'absError' | 'relError' | 'ulps' | 'digitsAgreed'>

/** Error figures plus the verdict, as one plain object. */
function withVerdict(e: ErrorFigures, verdict: CaseVerdict, decidedBy: string, region: string): CaseJudgement {
  return { absError: e.absError, relError: e.relError, ulps: e.ulps, digitsAgreed: e.digitsAgreed, verdict, decidedBy, region }
}

/** Pass or fail of |c − r| against the zero rule or the region's tolerance, exactly. */
function decide(cc: CompiledCriterion, t: CompiledTolerance, c: ExactDecimal, r: ExactDecimal, kappa: ExactDecimal | null, diff = absDiff(c, r)): { pass: boolean; part: string; T: Near } {
  if (zeroRuleApplies(cc, r)) {
    const T: Near = { v: cc.zeroAtol, nudge: 0 }
    return { pass: cmpNear(diff, T) <= 0, part: 'zero-rule', T }
  }
  const { T, part } = threshold(cc, t, r, kappa)
  return { pass: cmpNear(diff, T) <= 0, part, T }
}

/**
 * Whether moving r by δ could change the verdict: |c − r| moves by ≤ δ and
 * the bound by ≤ s·δ (s = rtol, or k·κ·u); ulps bounds jump at binade
 * edges and the zero rule switches at `below`, so those are checked too.
 */
function needsEndpoints(cc: CompiledCriterion, t: CompiledTolerance, r: ExactDecimal, digits: number, diff: Near, T: Near, kappa: ExactDecimal | null): boolean {
  const delta: ExactDecimal = { neg: false, coef: 5n, exp: order(r) - digits - 1 }
  const zero = zeroRuleApplies(cc, r)
  let s: ExactDecimal | null = null
  if (!zero) {
    if (t.kind === 'relative' || t.kind === 'mixed') s = t.rtol
    else if (t.kind === 'condition') {
      const kap = kappa === null || cmpAbs(kappa, t.kappaFloor) < 0 ? t.kappaFloor : kappa
      s = mulPow2(mulExact(t.k, kap), -cc.p)
    }
  }
  // Reach of a δ move: |c − r| by ≤ δ, the bound by ≤ s·δ.
  const reach = s ? addNear(delta, mulExact(delta, s)).v : delta
  const zb = cc.zeroBelow.coef !== 0n
  const orderR = order(r)
  // Far from the zero rule's edge and, for ulps, from a binade edge?
  const edgeFar = (!zb || Math.abs(orderR - order(cc.zeroBelow)) >= 2)
    && (zero || t.kind !== 'ulps' || binadeFar(r, digits))
  if (edgeFar) {
    // Quick test by orders of magnitude: when T and |c − r| differ by two or
    // more decades, their gap exceeds 10^(max order − 2).
    const oT = order(T.v)
    const oD = order(diff.v)
    const top = Math.max(oT, oD)
    if (Math.abs(oT - oD) >= 2 && order(reach) <= top - 2) return false
    const gap = absDiff(T.v, diff.v)
    return cmpNear({ v: gap.v, nudge: 0 }, { v: reach, nudge: 1 }) <= 0
  }
  return true
}

/** r ± δ stays inside one binade of powers of two (float test with a wide margin; false when unsure). */
function binadeFar(r: ExactDecimal, digits: number): boolean {
  const l2 = (log10Big(r.coef) + r.exp) * Math.LOG2E * Math.LN10
  const frac = l2 - Math.floor(l2)
  // Relative distance to the nearer power of two, against 2·δ/|r| ≤ 10^(1−d).
  const dist = Math.min(frac, 1 - frac) * Math.LN2
  return dist > 1e-9 && dist > 10 ** (1 - digits) * 4
}

/** Absolute and relative error, ULPs of the exact r in the format, and digits agreed. */
function errorFigures(d: ExactDecimal, r: ExactDecimal, digits: number, cc: CompiledCriterion): ErrorFigures {
  const absError = formatAbs(d)
  const q = ulpExp(r, cc.format)
  const ulps = formatRatio(d.coef, 1n, d.exp, 4, -q)
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
    out.ulps = '0'
    return out
  }
  return noErrors('non_finite', 'overflow-rule', region)
}
