/**
 * Acceptance criteria compiled for judging, and the definition-time check
 * that a criterion can be settled by the reference's certified digits.
 *
 * Bounds on the error of a measured value c against the reference r:
 *   absolute   |c − r| ≤ atol
 *   relative   |c − r| ≤ rtol·|r|
 *   mixed      |c − r| ≤ atol + rtol·|r|
 *   ulps       |c − r| ≤ maxUlps·ulp(r), ulp of the exact r in the format
 *   condition  |c − r| ≤ k·max(κ, kappaFloor)·u·|r|, u = 2^-p
 * u is the unit roundoff of the format, 2^-p with p = 24, 53, 113
 * (IEEE 754-2019 Table 3.5 for p; Higham, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed., §2.1 for u). The condition-scaled bound
 * follows Higham's rule of thumb forward error ≲ κ × backward error, with
 * a backward-stable code having backward error of order u; the floor on κ
 * (default 1) is our choice, so that κ ≈ 0 never demands an exact result.
 * All comparisons are exact (BigInt), see exact-ops.ts.
 */
import { parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { BINARY_FORMATS, type BinaryFormat } from '../numeric/binary-formats'
import { ulpExp } from './binary'
import type { Criterion, Tolerance } from '../schemas/criterion'
import { addNear, cmpAbs, exact, mulExact, mulPow2, order, type Near } from './exact-ops'
import { compileRegions, DEFAULT_REGION, selectRegion, type CompiledRegion } from './regions'

export type CompiledTolerance =
  | { kind: 'absolute'; atol: ExactDecimal }
  | { kind: 'relative'; rtol: ExactDecimal }
  | { kind: 'mixed'; atol: ExactDecimal; rtol: ExactDecimal }
  | { kind: 'ulps'; maxUlps: ExactDecimal }
  | { kind: 'condition'; k: ExactDecimal; kappaFloor: ExactDecimal }

export interface CompiledCriterion {
  source: Criterion
  format: BinaryFormat
  p: number
  tolerance: CompiledTolerance
  regions: Array<CompiledRegion<CompiledTolerance>>
  zeroBelow: ExactDecimal
  zeroAtol: ExactDecimal
  signedInf: 'pass' | 'fail'
  nanVerdict: 'non_finite' | 'fail'
}

const ex = (s: string) => parseExactDecimal(s)

/** Exact decimals for one tolerance rule. */
export function compileTolerance(t: Tolerance): CompiledTolerance {
  switch (t.kind) {
    case 'absolute': return { kind: 'absolute', atol: ex(t.atol) }
    case 'relative': return { kind: 'relative', rtol: ex(t.rtol) }
    case 'mixed': return { kind: 'mixed', atol: ex(t.atol), rtol: ex(t.rtol) }
    case 'ulps': return { kind: 'ulps', maxUlps: ex(t.maxUlps) }
    case 'condition': return { kind: 'condition', k: ex(t.k), kappaFloor: ex(t.kappaFloor ?? '1') }
  }
}

const CACHE = new WeakMap<Criterion, CompiledCriterion>()

/** Compile a parsed criterion once (cached by object identity; treat criteria as immutable). */
export function compileCriterion(c: Criterion): CompiledCriterion {
  const hit = CACHE.get(c)
  if (hit) return hit
  const format = c.format ?? 'binary64'
  const out: CompiledCriterion = {
    source: c,
    format,
    p: BINARY_FORMATS[format].p,
    tolerance: compileTolerance(c.tolerance),
    regions: compileRegions(c.regions ?? [], r => compileTolerance(r.tolerance)),
    zeroBelow: ex(c.zero.below),
    zeroAtol: ex(c.zero.atol),
    signedInf: c.overflow.signedInf,
    nanVerdict: c.nan?.verdict ?? 'non_finite',
  }
  CACHE.set(c, out)
  return out
}

/** The region name and its rule for a case's inputs (first match wins, else 'all'). */
export function regionFor(cc: CompiledCriterion, inputs: Record<string, string>): { name: string; tolerance: CompiledTolerance } {
  const r = selectRegion(cc.regions, inputs)
  return r ? { name: r.name, tolerance: r.payload } : { name: DEFAULT_REGION, tolerance: cc.tolerance }
}

/** Region name of a case, for storing with the case at definition time. */
export function regionOf(c: Criterion, inputs: Record<string, string>): string {
  return regionFor(compileCriterion(c), inputs).name
}

/** Whether the zero rule applies to reference r (r = 0, or |r| < below). */
export function zeroRuleApplies(cc: CompiledCriterion, r: ExactDecimal): boolean {
  return r.coef === 0n || (cc.zeroBelow.coef !== 0n && cmpAbs(r, cc.zeroBelow) < 0)
}

/** The bound T on |c − r| for reference r under rule t, and the part that decides. */
export function threshold(cc: CompiledCriterion, t: CompiledTolerance, r: ExactDecimal, kappa: ExactDecimal | null): { T: Near; part: string } {
  const absR: ExactDecimal = r.neg ? { neg: false, coef: r.coef, exp: r.exp } : r
  switch (t.kind) {
    case 'absolute': return { T: exact(t.atol), part: 'atol' }
    case 'relative': return { T: exact(mulExact(t.rtol, absR)), part: 'rtol' }
    case 'mixed': return { T: addNear(t.atol, mulExact(t.rtol, absR)), part: 'atol+rtol' }
    case 'ulps': return { T: exact(mulPow2(t.maxUlps, ulpExp(absR, cc.format))), part: 'ulps' }
    case 'condition': {
      const useFloor = kappa === null || cmpAbs(kappa, t.kappaFloor) < 0
      const kap = useFloor ? t.kappaFloor : kappa
      return { T: exact(mulPow2(mulExact(mulExact(t.k, kap), absR), -cc.p)), part: useFloor ? 'kappa-floor' : 'kappa' }
    }
  }
}

/** The smallest relative bound a rule can impose on any reference, or null if it has none (absolute). */
export function relativeFloor(t: CompiledTolerance, p: number): ExactDecimal | null {
  switch (t.kind) {
    case 'absolute': return null
    case 'relative': return t.rtol
    case 'mixed': return t.rtol.coef === 0n ? null : t.rtol
    // ulp(r)/|r| > 2^-p for every r in the normal range (IEEE 754-2019 §3.3).
    case 'ulps': return mulPow2(t.maxUlps, -p)
    case 'condition': return mulPow2(mulExact(t.k, t.kappaFloor), -p)
  }
}

/**
 * Settling margin (our rule): a tolerance must be at least ten times the
 * reference's worst-case relative rounding error 5·10^-d, i.e. ≥ 5·10^(1−d).
 * The judge still checks each case near its boundary (judge.ts).
 */
export function settleableAt(tol: ExactDecimal, digits: number): boolean {
  return cmpAbs(tol, { neg: false, coef: 5n, exp: 1 - digits }) >= 0
}

/** The fewest certified digits that can settle a relative tolerance (Infinity for 0). */
export function digitsNeededFor(tol: ExactDecimal): number {
  if (tol.coef === 0n) return Infinity
  for (let d = 1; d <= 1000; d++) if (settleableAt(tol, d)) return d
  return Infinity
}

const short = (x: ExactDecimal) => Number(`${x.coef}e${x.exp}`).toPrecision(3).replace(/\.?0+e/, 'e')

/**
 * Definition-time check: every relative-type rule (default and regions) must
 * be settleable at the target digits. Returns messages, empty when fine.
 * Absolute bounds depend on the reference magnitudes; checkReferenceSettles
 * covers them once the values are computed.
 */
export function checkCriterionDigits(c: Criterion, targetDigits: number): string[] {
  const cc = compileCriterion(c)
  const rules: Array<[string, CompiledTolerance]> = [[DEFAULT_REGION, cc.tolerance], ...cc.regions.map(r => [r.name, r.payload] as [string, CompiledTolerance])]
  const out: string[] = []
  for (const [name, t] of rules) {
    const rel = relativeFloor(t, cc.p)
    if (rel === null || settleableAt(rel, targetDigits)) continue
    const need = digitsNeededFor(rel)
    const what = t.kind === 'relative' || t.kind === 'mixed' ? `rtol ${short(rel)}` : `the ${t.kind} rule (a relative bound down to about ${short(rel)})`
    out.push(need === Infinity
      ? `Region '${name}': ${t.kind === 'ulps' ? 'maxUlps 0' : 'a zero tolerance'} demands an exact match, which no certified reference can settle. Use a positive tolerance.`
      : `Region '${name}': ${what} is tighter than ${targetDigits} certified digits can settle (they settle down to ${short({ neg: false, coef: 5n, exp: 1 - targetDigits })}). Raise the target digits to at least ${need}, or loosen the tolerance.`)
  }
  return out
}

export interface SettleIssue { index: number; message: string }

/**
 * After the reference values are computed: each case's bound (zero rule or
 * tolerance) must be at least ten half-units of the reference's last
 * certified digit. Returns up to `limit` issues.
 */
export function checkReferenceSettles(c: Criterion, cases: Array<{ value: string; digits: number; kappa: string | null; inputs: Record<string, string>; region?: string }>, limit = 20): SettleIssue[] {
  const cc = compileCriterion(c)
  const out: SettleIssue[] = []
  for (let i = 0; i < cases.length && out.length < limit; i++) {
    const cs = cases[i]!
    const r = ex(cs.value)
    if (r.coef === 0n) continue
    // Ten half-units of the last certified digit: 10 · ½·10^(order − d).
    const halfUnit10: ExactDecimal = { neg: false, coef: 5n, exp: order(r) - cs.digits }
    const rule = zeroRuleApplies(cc, r) ? null : regionRule(cc, cs)
    const T = rule ? threshold(cc, rule.tolerance, r, cs.kappa === null ? null : ex(cs.kappa)).T.v : cc.zeroAtol
    if (cmpAbs(T, halfUnit10) < 0) {
      out.push({ index: i, message: `Case ${i + 1} (${Object.entries(cs.inputs).map(([k, v]) => `${k}=${v}`).join(', ')}): the bound ${short(T)} is finer than its ${cs.digits} certified digits can settle. Raise the target digits or loosen the ${rule ? 'tolerance' : 'zero rule'}.` })
    }
  }
  return out
}

/** The rule for a case: its stored region name when given, else selected from its inputs. */
export function regionRule(cc: CompiledCriterion, cs: { inputs: Record<string, string>; region?: string }) {
  if (cs.region !== undefined) {
    const r = cc.regions.find(x => x.name === cs.region)
    if (r) return { name: r.name, tolerance: r.payload }
    if (cs.region === DEFAULT_REGION) return { name: DEFAULT_REGION, tolerance: cc.tolerance }
  }
  return regionFor(cc, cs.inputs)
}
