/**
 * The reference engine's uniform entry point.
 *
 *   evaluate(id, params, digits)       one case
 *   evaluateBatch(id, cases, digits)   many cases, sharing work where it can
 *
 * Parameters are decimal strings, parsed exactly. Each output carries its
 * certified digits, κ where defined, and the engine says how it certified
 * the case. Pure TypeScript: no Vue, no Nitro.
 */
import { DomainError, parseExactDecimal, toIndex, type ExactDecimal } from '../numeric/exact'
import { CATALOGUE, isFunctionId, type FunctionId, type ParameterSpec } from './catalogue'
import { hermite, hermiteProb, hermiteDerivative, hermiteTable, formatKappa, type ScalarResult } from './hermite'
import { hermiteFunction } from './hermite-function'
import { hermiteSeries } from './series'
import { kummer } from './kummer'
import { parabolicCylinder } from './parabolic-cylinder'
import { cachedRule, type QuadratureWeight } from './gauss-hermite'
import type { CertificationMethod } from './certify'

export { CATALOGUE, FUNCTION_IDS, isFunctionId, type FunctionId, type CatalogueEntry, type ParameterSpec } from './catalogue'
export { DomainError } from '../numeric/exact'
export type { CertifiedValue, CertificationMethod } from './certify'
export { gaussHermiteRule, type QuadratureRule, type QuadratureWeight } from './gauss-hermite'

export const MIN_DIGITS = 1
export const MAX_DIGITS = 300

export interface OutputValue {
  name: string
  /** Correctly rounded to `digits` significant digits, e-notation; '0' for exact zero. */
  value: string
  digits: number
  exact: boolean
  /** κ = |x f′/f| to 4 significant digits; null where undefined or not certified. */
  kappa: string | null
}

export interface EvaluationResult {
  id: FunctionId
  params: Record<string, string>
  outputs: OutputValue[]
  certification: CertificationMethod
  note: string
}

const NOTE_BOUND = 'rigorous error bound carried through BigInt fixed point (and correctly rounded Decimal steps); value correctly rounded'
const NOTE_AGREE = 'agreement of two working precisions 12 digits apart, with a 100× margin; value correctly rounded if the estimate holds'

export function checkDigits(digits: number): void {
  if (!Number.isInteger(digits) || digits < MIN_DIGITS || digits > MAX_DIGITS) {
    throw new DomainError(`digits must be an integer from ${MIN_DIGITS} to ${MAX_DIGITS}`, 'digits')
  }
}

type Parsed = Record<string, ExactDecimal | string>

/** log10 |v| of an e-notation value string ('0' gives −Infinity). */
function log10Abs(v: string): number {
  const [m, e] = v.replace(/^-/, '').split('e') as [string, string | undefined]
  return Math.log10(Number(m)) + (e ? Number(e) : 0)
}

/** Check one case's parameters against the catalogue (throws DomainError). */
export function validateParams(id: string, params: Record<string, string>): void {
  if (!isFunctionId(id)) throw new DomainError(`unknown function '${id}'`, 'id')
  parseParams(id, params)
}

function parseParams(id: FunctionId, params: Record<string, string>): Parsed {
  const specs = CATALOGUE[id].parameters
  for (const key of Object.keys(params)) {
    if (!specs.some((s) => s.name === key)) throw new DomainError(`unknown parameter '${key}' for ${id}`, key)
  }
  const out: Parsed = {}
  for (const spec of specs) {
    const raw = params[spec.name] ?? spec.default
    if (raw === undefined || raw === '') throw new DomainError(`missing parameter '${spec.name}'`, spec.name)
    out[spec.name] = parseOne(spec, raw)
  }
  return out
}

function parseOne(spec: ParameterSpec, raw: string): ExactDecimal | string {
  if (spec.kind === 'choice') {
    if (!spec.choices!.includes(raw)) throw new DomainError(`${spec.name} must be one of ${spec.choices!.join(', ')}`, spec.name)
    return raw
  }
  const v = parseExactDecimal(raw, spec.name)
  if (spec.kind === 'integer') toIndex(v, spec.name, spec.min ?? 0, spec.max ?? Number.MAX_SAFE_INTEGER)
  else {
    const approx = Number(`${v.neg ? '-' : ''}${v.coef}e${v.exp}`)
    if ((spec.min !== undefined && approx < spec.min) || (spec.max !== undefined && approx > spec.max)) {
      throw new DomainError(`${spec.name} must lie in [${spec.min}, ${spec.max}]`, spec.name)
    }
  }
  return v
}

const ex = (p: Parsed, k: string) => p[k] as ExactDecimal
const int = (p: Parsed, k: string) => toIndex(ex(p, k), k, 0, Number.MAX_SAFE_INTEGER)

function scalar(name: string, r: ScalarResult): OutputValue {
  return { name, value: r.value, digits: r.digits, exact: r.exact, kappa: r.kappa }
}

function method(outputs: OutputValue[], rigorous: boolean): { certification: CertificationMethod; note: string } {
  if (outputs.every((o) => o.exact)) return { certification: 'exact', note: 'exact value, correctly rounded' }
  return rigorous ? { certification: 'rigorous-bound', note: NOTE_BOUND } : { certification: 'precision-agreement', note: NOTE_AGREE }
}

function evaluateParsed(id: FunctionId, p: Parsed, digits: number): { outputs: OutputValue[]; rigorous: boolean } {
  switch (id) {
    case 'hermite': return { outputs: [scalar('value', hermite(int(p, 'n'), ex(p, 'x'), digits))], rigorous: true }
    case 'hermite-prob': return { outputs: [scalar('value', hermiteProb(int(p, 'n'), ex(p, 'x'), digits))], rigorous: true }
    case 'hermite-function': return { outputs: [scalar('value', hermiteFunction(int(p, 'n'), ex(p, 'x'), digits))], rigorous: true }
    case 'hermite-derivative':
      return { outputs: [scalar('value', hermiteDerivative(int(p, 'n'), int(p, 'k'), ex(p, 'x'), digits))], rigorous: true }
    case 'hermite-series': {
      const r = hermiteSeries(ex(p, 'lambda'), ex(p, 'x'), digits)
      return { outputs: [scalar('y_even', r.even), scalar('y_odd', r.odd)], rigorous: true }
    }
    case 'kummer': return { outputs: [scalar('value', kummer(ex(p, 'a'), ex(p, 'b'), ex(p, 'z'), digits))], rigorous: true }
    case 'parabolic-cylinder': {
      const nu = ex(p, 'nu')
      const r = parabolicCylinder(nu, ex(p, 'z'), digits)
      return { outputs: [scalar('value', r)], rigorous: !nu.neg && nu.exp >= 0 }
    }
    case 'gauss-hermite': {
      const n = int(p, 'n')
      const i = int(p, 'i')
      if (i > n) throw new DomainError('i must be at most n', 'i')
      const rule = cachedRule(n, p.weight as QuadratureWeight, digits)
      return {
        outputs: [{ name: 'node', ...rule.nodes[i - 1]!, kappa: null }, { name: 'weight', ...rule.weights[i - 1]!, kappa: null }],
        rigorous: true,
      }
    }
  }
}

export function evaluate(id: string, params: Record<string, string>, digits: number): EvaluationResult {
  if (!isFunctionId(id)) throw new DomainError(`unknown function '${id}'`, 'id')
  checkDigits(digits)
  const parsed = parseParams(id, params)
  const { outputs, rigorous } = evaluateParsed(id, parsed, digits)
  return { id, params: { ...params }, outputs, ...method(outputs, rigorous) }
}

/**
 * Many cases of one function. Cases of `hermite` / `hermite-prob` that share
 * an x are done with one recurrence up to their largest n; Gauss–Hermite
 * rules are computed once per (n, weight). Results keep the input order.
 * A case with bad input throws; validate first if partial results matter.
 */
export function evaluateBatch(id: string, cases: Array<Record<string, string>>, digits: number): EvaluationResult[] {
  if (!isFunctionId(id)) throw new DomainError(`unknown function '${id}'`, 'id')
  checkDigits(digits)
  const parsed = cases.map((c) => parseParams(id, c))
  if (id !== 'hermite' && id !== 'hermite-prob') return cases.map((c, i) => {
    const { outputs, rigorous } = evaluateParsed(id, parsed[i]!, digits)
    return { id, params: { ...c }, outputs, ...method(outputs, rigorous) }
  })
  const family = id === 'hermite' ? 'H' : 'He'
  const groups = new Map<string, number[]>()
  parsed.forEach((p, i) => {
    const x = ex(p, 'x')
    const key = `${x.neg ? '-' : ''}${x.coef}e${x.exp}`
    const g = groups.get(key)
    if (g) g.push(i)
    else groups.set(key, [i])
  })
  const results: EvaluationResult[] = new Array(cases.length)
  for (const idx of groups.values()) {
    const x = ex(parsed[idx[0]!]!, 'x')
    const ns = idx.map((i) => int(parsed[i]!, 'n'))
    if (idx.length === 1) {
      const r = family === 'H' ? hermite(ns[0]!, x, digits) : hermiteProb(ns[0]!, x, digits)
      const outputs = [scalar('value', r)]
      results[idx[0]!] = { id, params: { ...cases[idx[0]!]! }, outputs, ...method(outputs, true) }
      continue
    }
    const row = hermiteTable(family, Math.max(...ns), [x], digits)[0]!
    const xl = log10Abs(`${x.coef}e${x.exp}`)
    idx.forEach((i, j) => {
      const n = ns[j]!
      // κ = |x c2(n) y_{n−1}/y_n| from the certified row (≥ 6 digits).
      const c2 = family === 'H' ? 2 * n : n
      const ok = n > 0 && digits >= 6 && row[n]!.digits >= 6 && row[n - 1]!.digits >= 6 && row[n]!.value !== '0'
      const kappa = n === 0 || x.coef === 0n ? (row[n]!.value === '0' ? null : '0')
        : ok ? formatKappa(10 ** (xl + Math.log10(c2) + log10Abs(row[n - 1]!.value) - log10Abs(row[n]!.value))) : null
      const outputs = [{ name: 'value', ...row[ns[j]!]!, kappa }]
      results[i] = { id, params: { ...cases[i]! }, outputs, ...method(outputs, true) }
    })
  }
  return results
}
