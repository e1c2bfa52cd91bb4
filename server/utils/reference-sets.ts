// Reference sets on the server: validating a definition (the shared zod
// schema, then expanding its grid so domain errors come back as 400s), the
// summary shape pages read, and re-rounding stored values for downloads.
import Decimal from 'decimal.js'
import { count, desc, eq } from 'drizzle-orm'
import { expandReferenceSet, GridError, type SetCase } from '../../shared/grid'
import { CATALOGUE, evaluate, isFunctionId } from '../../shared/reference'
import { referenceSetSchema, type ReferenceSetDefinition } from '../../shared/schemas/reference-set'
import type { ReferenceSetSummary } from '../../shared/domain/api-types'
import type { ReferenceSet } from '../database/schema'
import { enqueue } from '../jobs/queue'
import type { CurrentUser } from './auth'

export function parseDefinition(body: unknown): { def: ReferenceSetDefinition, cases: SetCase[] } {
  const def = parseOr400(referenceSetSchema, body, 'reference set')
  try {
    return { def, cases: expandReferenceSet(def) }
  }
  catch (e) {
    if (e instanceof GridError) {
      const issues = e.issues.length
        ? e.issues.map(i => ({ field: `grid.parts.${i.part}${i.point !== undefined ? `.points.${i.point}` : ''}`, message: i.message }))
        : [{ field: 'grid', message: e.message }]
      throw httpError(400, 'invalid_input', `Invalid reference set: ${e.message}`, { issues })
    }
    throw httpError(400, 'invalid_input', `Invalid reference set: ${(e as Error).message}`, { issues: [{ field: 'criterion', message: (e as Error).message }] })
  }
}

export function summaryOf(s: ReferenceSet): ReferenceSetSummary {
  return {
    id: s.id, slug: s.slug, revision: s.revision, name: s.name, functionId: s.functionId, convention: s.convention,
    targetDigits: s.targetDigits, state: s.state, caseCount: s.caseCount, casesDone: s.casesDone,
    frozenAt: s.frozenAt ? new Date(s.frozenAt).toISOString() : null, source: s.source,
  }
}

/** The definition as the form submitted it, rebuilt from the row. */
export function definitionOf(s: ReferenceSet): ReferenceSetDefinition {
  return {
    name: s.name, slug: s.slug, functionId: s.functionId as ReferenceSetDefinition['functionId'], output: s.output,
    convention: s.convention, grid: s.grid as ReferenceSetDefinition['grid'], targetDigits: s.targetDigits,
    criterion: s.criterion as ReferenceSetDefinition['criterion'], source: s.source, notes: s.notes,
  }
}

export async function loadSet(id: number): Promise<ReferenceSet> {
  const [set] = await useDb().select().from(schema.referenceSets).where(eq(schema.referenceSets.id, id))
  if (!set) throw httpError(404, 'not_found', `There is no reference set with id ${id}.`)
  return set
}

/** The newest revision of the set with this slug, or a 404 naming the field `set`. */
export async function loadNewestRevision(slug: string): Promise<ReferenceSet> {
  const set = await latestRevision(slug)
  if (!set) throw httpError(404, 'not_found', `There is no reference set "${slug}".`, { issues: [{ field: 'set', message: 'No set has this slug.' }] })
  return set
}

export async function latestRevision(slug: string) {
  const [row] = await useDb().select().from(schema.referenceSets).where(eq(schema.referenceSets.slug, slug)).orderBy(desc(schema.referenceSets.revision)).limit(1)
  return row ?? null
}

export async function runCount(setId: number) {
  const [row] = await useDb().select({ n: count() }).from(schema.runs).where(eq(schema.runs.setId, setId))
  return row?.n ?? 0
}

/** The function's parameter names, in catalogue order. */
export function parameterNames(functionId: string): string[] {
  return isFunctionId(functionId) ? CATALOGUE[functionId].parameters.map(p => p.name) : []
}

/**
 * A stored value (correctly rounded to `stored` digits) rounded to `digits`.
 * Rounding a rounded value again is wrong only when the dropped digits are a
 * tie (5 followed by zeros): then the engine computes the case afresh.
 */
export function reround(value: string, stored: number, digits: number, recompute: () => string): string {
  if (digits >= stored || value === '0') return value
  const D = Decimal.clone({ precision: digits, rounding: Decimal.ROUND_HALF_EVEN })
  const v = new Decimal(value)
  const mant = v.abs().toExponential(stored - 1).split('e')[0]!.replace('.', '')
  const dropped = mant.slice(digits)
  if (/^50*$/.test(dropped)) return recompute()
  return new D(value).toSignificantDigits(digits).toExponential(digits - 1)
}

export function recomputeValue(set: ReferenceSet, inputs: Record<string, string>, digits: number): string {
  const out = evaluate(set.functionId, inputs, digits).outputs
  return (out.find(o => o.name === set.output) ?? out[0])!.value
}

/** Store a definition as a new revision and queue the computation of its cases. */
export async function createRevision(user: CurrentUser, def: ReferenceSetDefinition, caseCount: number, revision: number, supersedesId: number | null) {
  const db = useDb()
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(schema.referenceSets).values({
      slug: def.slug, revision, name: def.name, functionId: def.functionId, convention: def.convention,
      output: def.output ?? CATALOGUE[def.functionId].outputs[0]!, grid: def.grid, targetDigits: def.targetDigits, criterion: def.criterion,
      source: def.source, notes: def.notes, state: 'computing', caseCount, supersedesId, createdBy: user.id,
    }).$returningId()
    await enqueue(tx, 'reference-set', { setId: row!.id }, caseCount)
    await recordAudit(tx, user, revision === 1 ? 'create-reference-set' : 'revise-reference-set', 'reference-set', row!.id, { slug: def.slug, revision, caseCount })
    return row!.id
  })
  return summaryOf(await loadSet(id))
}
