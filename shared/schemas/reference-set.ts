/**
 * The definition of a reference set, shared by the set form and the server:
 * name, slug, function, convention, the case grid, target certified digits,
 * the acceptance criterion, and where the set comes from.
 *
 * A grid is the union of its parts (a union of unions is just more parts):
 * - points: explicit rows of exact input strings;
 * - range:  per-parameter start/stop/step (exact decimals) or value lists,
 *           combined as a cartesian product, the last axis varying fastest;
 * - random: seeded points in a box (shared/grid/prng.ts), each parameter
 *           drawn uniformly on the lattice min, min + 10^-places, …, max.
 * Cross-checks against the function catalogue (parameter names, region
 * expressions, the digits the criterion needs) run in superRefine, so the
 * form and the server report the same issues on the same fields.
 */
import { z } from 'zod'
import { CATALOGUE, FUNCTION_IDS, type FunctionId } from '../reference/catalogue'
import { checkCriterionDigits } from '../compare/criterion'
import { expressionNames, parseExpression } from '../compare/expression'
import { criterionSchema, type Criterion } from './criterion'

export const MIN_TARGET_DIGITS = 15
export const MAX_TARGET_DIGITS = 100
export const MAX_CASES = 200_000

const DECIMAL_RE = /^[+-]?(\d+\.?\d*|\.\d+)(?:[eE][+-]?\d{1,4})?$/
export const exactInput = z.string().trim().min(1, { error: 'Enter a value.' }).max(60, { error: 'Use at most 60 characters.' })
const decimalInput = exactInput.regex(DECIMAL_RE, { error: 'Enter a decimal number such as 0.5, -3 or 1.25e-3.' })
const paramName = z.string().trim().min(1).max(40)

export const pointsPartSchema = z.object({
  kind: z.literal('points'),
  points: z.array(z.record(paramName, exactInput)).min(1, { error: 'Add at least one point.' }).max(MAX_CASES),
})

export const rangeAxisSchema = z.union([
  z.object({ param: paramName, start: decimalInput, stop: decimalInput, step: decimalInput }),
  z.object({ param: paramName, values: z.array(exactInput).min(1).max(10_000) }),
])

export const rangePartSchema = z.object({
  kind: z.literal('range'),
  axes: z.array(rangeAxisSchema).min(1).max(8),
})

export const randomAxisSchema = z.object({
  param: paramName,
  min: decimalInput,
  max: decimalInput,
  /** Decimal places of the drawn values (0 for integers). */
  places: z.int().min(0).max(30),
})

export const randomPartSchema = z.object({
  kind: z.literal('random'),
  /** Any integer 0 … 2^53 − 1; the same seed gives the same points everywhere. */
  seed: z.int().min(0).max(Number.MAX_SAFE_INTEGER),
  /** Draws; repeated points are removed, so the part may yield fewer. */
  count: z.int().min(1).max(MAX_CASES),
  axes: z.array(randomAxisSchema).min(1).max(8),
  /** Parameters held fixed for every draw, e.g. {"weight": "physicists"}. */
  fixed: z.record(paramName, exactInput).default({}),
})

export const gridPartSchema = z.discriminatedUnion('kind', [pointsPartSchema, rangePartSchema, randomPartSchema],
  { error: 'Choose a grid part: points, range or random.' })
export const gridSchema = z.object({ parts: z.array(gridPartSchema).min(1, { error: 'Add at least one grid part.' }).max(32) })

export type GridPart = z.infer<typeof gridPartSchema>
export type Grid = z.infer<typeof gridSchema>

export const referenceSetSchema = z.object({
  name: z.string().trim().min(1, { error: 'Name the set.' }).max(160),
  slug: z.string().trim().min(2).max(80).regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: 'Use lower-case letters, digits and single hyphens.' }),
  functionId: z.enum(FUNCTION_IDS as [FunctionId, ...FunctionId[]], { error: `Choose a function: ${FUNCTION_IDS.join(', ')}.` }),
  /** Which output of the function the set checks (default: its first, e.g. 'value' or 'node'). */
  output: z.string().trim().min(1).max(40).optional(),
  convention: z.string().trim().min(1, { error: 'State the convention.' }).max(60),
  grid: gridSchema,
  targetDigits: z.int({ error: 'Target digits must be a whole number.' })
    .min(MIN_TARGET_DIGITS, { error: `Target digits must be from ${MIN_TARGET_DIGITS} to ${MAX_TARGET_DIGITS}.` })
    .max(MAX_TARGET_DIGITS, { error: `Target digits must be from ${MIN_TARGET_DIGITS} to ${MAX_TARGET_DIGITS}.` }),
  criterion: criterionSchema,
  source: z.string().trim().max(4000).default(''),
  notes: z.string().trim().max(4000).default(''),
}).superRefine((d, ctx) => {
  const spec = CATALOGUE[d.functionId]
  const numeric = new Set(spec.parameters.filter(p => p.kind !== 'choice').map(p => p.name))
  const all = new Set(spec.parameters.map(p => p.name))
  const known = (name: string, path: Array<string | number>) => {
    if (!all.has(name)) ctx.addIssue({ code: 'custom', path, message: `${d.functionId} has no parameter '${name}' (it has ${[...all].join(', ')}).` })
  }
  if (d.output !== undefined && !spec.outputs.includes(d.output)) {
    ctx.addIssue({ code: 'custom', path: ['output'], message: `${d.functionId} outputs ${spec.outputs.join(', ')}.` })
  }
  d.grid.parts.forEach((part, i) => {
    const at = ['grid', 'parts', i]
    if (part.kind === 'points') part.points.forEach((p, j) => Object.keys(p).forEach(k => known(k, [...at, 'points', j, k])))
    else {
      part.axes.forEach((a, j) => known(a.param, [...at, 'axes', j, 'param']))
      const names = part.axes.map(a => a.param)
      if (new Set(names).size !== names.length) ctx.addIssue({ code: 'custom', path: [...at, 'axes'], message: 'Each parameter may appear on one axis only.' })
      if (part.kind === 'random') {
        Object.keys(part.fixed).forEach(k => known(k, [...at, 'fixed', k]))
        part.axes.forEach((a, j) => { if (!numeric.has(a.param)) ctx.addIssue({ code: 'custom', path: [...at, 'axes', j, 'param'], message: `'${a.param}' is not numeric; fix it under 'fixed'.` }) })
      }
    }
  })
  // Field-level issues (a malformed number or expression) are already reported; the
  // cross-checks below then stay quiet rather than throw on the malformed value.
  const quiet = (f: () => void) => { try { f() } catch { /* reported on its field */ } }
  quiet(() => checkRegions(d.criterion, numeric, all, ctx))
  quiet(() => {
    for (const message of checkCriterionDigits(d.criterion, d.targetDigits)) ctx.addIssue({ code: 'custom', path: ['targetDigits'], message })
  })
})

/** Region conditions must name the function's parameters; choice parameters compare by equals/notEquals only. */
function checkRegions(c: Criterion, numeric: Set<string>, all: Set<string>, ctx: z.RefinementCtx): void {
  c.regions.forEach((r, i) => r.when.forEach((cond, j) => {
    const path = ['criterion', 'regions', i, 'when', j]
    if (!all.has(cond.param)) {
      ctx.addIssue({ code: 'custom', path: [...path, 'param'], message: `No parameter '${cond.param}' (use one of ${[...all].join(', ')}).` })
      return
    }
    if (!numeric.has(cond.param)) {
      if (cond.op !== 'equals' && cond.op !== 'notEquals') ctx.addIssue({ code: 'custom', path: [...path, 'op'], message: `'${cond.param}' is a choice; use equals or notEquals.` })
      return
    }
    let names: string[]
    try { names = expressionNames(parseExpression(cond.value)) } catch { return }
    const bad = names.filter(n => !numeric.has(n))
    if (bad.length) ctx.addIssue({ code: 'custom', path: [...path, 'value'], message: `Unknown name ${bad.map(b => `'${b}'`).join(', ')}; use numbers and ${[...numeric].join(', ')}.` })
  }))
}

export type ReferenceSetDefinition = z.infer<typeof referenceSetSchema>
export type ReferenceSetInput = z.input<typeof referenceSetSchema>
