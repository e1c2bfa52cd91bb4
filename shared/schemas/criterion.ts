/**
 * The acceptance criterion of a reference set, as data: a tolerance rule for
 * the default region 'all', optional named regions of the grid with their
 * own rule (first match wins), the target binary format, and the explicit
 * rules for reference zeros, overflow and NaN.
 *
 * Shared by the set form and the server (types from z.infer). Tolerances
 * are exact decimal strings, never JS numbers, so "1e-15" stays exact.
 * Region conditions are data plus a tiny arithmetic grammar parsed by
 * shared/compare/expression.ts; nothing is ever eval'd.
 */
import { z } from 'zod'
import { parseExpression } from '../compare/expression'

const DECIMAL_RE = /^[+]?(\d+\.?\d*|\.\d+)(?:[eE][+-]?\d{1,4})?$/

/** A non-negative exact decimal of at most 30 significant digits. */
export const nonNegativeDecimal = z.string().trim().max(40)
  .regex(DECIMAL_RE, { error: 'Enter a non-negative decimal number such as 1e-15 or 0.5.' })
  .refine(s => s.replace(/[eE].*$/, '').replace(/\D/g, '').replace(/^0+/, '').replace(/0+$/, '').length <= 30,
    { error: 'Use at most 30 significant digits.' })

const positiveDecimal = nonNegativeDecimal.refine(s => /[1-9]/.test(s.replace(/[eE].*$/, '')), { error: 'Must be greater than zero.' })

export const BINARY_FORMAT_IDS = ['binary32', 'binary64', 'binary128'] as const
export const binaryFormatSchema = z.enum(BINARY_FORMAT_IDS, { error: 'Choose binary32, binary64 or binary128.' })

/** One tolerance rule; which quantity it bounds is in its header comment in shared/compare/criterion.ts. */
export const toleranceSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('absolute'), atol: nonNegativeDecimal }),
  z.object({ kind: z.literal('relative'), rtol: positiveDecimal }),
  z.object({ kind: z.literal('mixed'), atol: nonNegativeDecimal, rtol: nonNegativeDecimal }),
  z.object({ kind: z.literal('ulps'), maxUlps: nonNegativeDecimal }),
  z.object({
    kind: z.literal('condition'),
    k: positiveDecimal,
    /** κ used when the case has none, and the least κ used (so κ = 0 does not demand exactness). */
    kappaFloor: positiveDecimal.default('1'),
  }),
], { error: 'Choose a criterion kind: absolute, relative, mixed, ulps or condition.' })
export type Tolerance = z.infer<typeof toleranceSchema>

export const CONDITION_OPS = [
  'lessThan', 'atMost', 'greaterThan', 'atLeast', 'equals', 'notEquals',
  'absLessThan', 'absAtMost', 'absGreaterThan', 'absAtLeast',
] as const
export type ConditionOp = (typeof CONDITION_OPS)[number]

const expressionText = z.string().trim().min(1, { error: 'Enter a value or expression.' }).max(200)
  .superRefine((s, ctx) => {
    try { parseExpression(s) } catch (e) { ctx.addIssue({ code: 'custom', message: (e as Error).message }) }
  })

/** `param op value`: value is an expression over the function's numeric parameters, e.g. sqrt(2*n+1). */
export const conditionSchema = z.object({
  param: z.string().trim().min(1).max(40),
  op: z.enum(CONDITION_OPS, { error: `Choose one of: ${CONDITION_OPS.join(', ')}.` }),
  value: expressionText,
})
export type RegionCondition = z.infer<typeof conditionSchema>

const regionName = z.string().trim().min(1, { error: 'Name the region.' }).max(60)
  .regex(/^[a-z0-9][a-z0-9_-]*$/, { error: 'Use lower-case letters, digits, - and _.' })
  .refine(s => s !== 'all', { error: "'all' is the name of the default region." })

export const regionSchema = z.object({
  name: regionName,
  /** All conditions must hold (AND). Write two regions for an OR. */
  when: z.array(conditionSchema).min(1, { error: 'A region needs at least one condition.' }).max(8),
  tolerance: toleranceSchema,
})
export type Region = z.infer<typeof regionSchema>

/** References with |r| < below (or exactly 0 when below is 0) are judged by |c − r| ≤ atol. */
export const zeroRuleSchema = z.object({ below: nonNegativeDecimal, atol: nonNegativeDecimal })

/**
 * A reference past the format's largest finite value expects ±inf of the
 * same sign; `signedInf` says whether that inf counts as pass or fail.
 */
export const overflowRuleSchema = z.object({ signedInf: z.enum(['pass', 'fail']) })

/** A measured NaN is non_finite unless the rule says fail. */
export const nanRuleSchema = z.object({ verdict: z.enum(['non_finite', 'fail']).default('non_finite') })

export const criterionSchema = z.object({
  format: binaryFormatSchema.default('binary64'),
  tolerance: toleranceSchema,
  regions: z.array(regionSchema).max(16).default([]),
  zero: zeroRuleSchema,
  overflow: overflowRuleSchema,
  nan: nanRuleSchema.default({ verdict: 'non_finite' }),
}).superRefine((c, ctx) => {
  const seen = new Set<string>()
  c.regions.forEach((r, i) => {
    if (seen.has(r.name)) ctx.addIssue({ code: 'custom', path: ['regions', i, 'name'], message: `Region name '${r.name}' is used twice.` })
    seen.add(r.name)
  })
})
export type Criterion = z.infer<typeof criterionSchema>
export type CriterionInput = z.input<typeof criterionSchema>
