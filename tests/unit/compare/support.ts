/** Helpers for the judging tests: criteria from short specs, exact references. */
import { criterionSchema, type Criterion, type CriterionInput } from '../../../shared/schemas/criterion'
import type { MeasuredValue, ReferenceValue } from '../../../shared/compare/judge'

/** A parsed criterion; zero and overflow rules default to exact zeros and inf = pass unless given. */
export function crit(spec: Partial<CriterionInput> & Pick<CriterionInput, 'tolerance'>): Criterion {
  return criterionSchema.parse({ zero: { below: '0', atol: '0' }, overflow: { signedInf: 'pass' }, ...spec })
}

/** A reference that is exactly its value (so boundary cases are settled). */
export const exactRef = (value: string, kappa: string | null = null): ReferenceValue => ({ value, digits: 30, kappa, exact: true })
/** A reference certified to `digits` digits, not exact. */
export const certRef = (value: string, digits: number, kappa: string | null = null): ReferenceValue => ({ value, digits, kappa })

/** A measured cell the way the parser hands it over. */
export function cell(raw: string): MeasuredValue {
  const t = raw.trim().toLowerCase()
  if (t === '') return { raw, kind: 'empty' }
  if (/^\*+$/.test(t)) return { raw, kind: 'overflowed' }
  if (/^[+-]?nan$/.test(t)) return { raw, kind: 'nan' }
  if (/^[+-]?inf(inity)?$/.test(t)) return { raw, kind: 'inf', sign: t.startsWith('-') ? -1 : 1 }
  if (/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/.test(t)) return { raw, kind: 'number', value: raw.trim() }
  return { raw, kind: 'text' }
}

/** 1 + 2^-52 and friends, written exactly. */
export const ONE_PLUS_ULP = '1.0000000000000002220446049250313080847263336181640625'
export const ONE_PLUS_2ULP = '1.000000000000000444089209850062616169452667236328125'
