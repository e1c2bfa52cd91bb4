/**
 * Expanding a grid into its cases: the union of the parts in order, each
 * point completed with the catalogue's defaults, validated against the
 * function's parameter domains (the engine's validateParams), deduplicated
 * by canonical input key (first occurrence kept, with its spelling), and
 * held to a cap on the number of cases.
 */
import { validateParams } from '../reference/index'
import { CATALOGUE, isFunctionId } from '../reference/catalogue'
import { MAX_CASES, type Grid, type GridPart, type ReferenceSetDefinition } from '../schemas/reference-set'
import { regionOf } from '../compare/criterion'
import { inputKey } from './keys'
import { GridError, randomPoints, rangePoints, type GridIssue } from './parts'

export interface GridCase {
  /** 0-based position in the expanded grid. */
  ordinal: number
  inputs: Record<string, string>
  key: string
}

export interface ExpandOptions { cap?: number; maxIssues?: number }

/** The raw points of one part, in its stable order. */
function partPoints(i: number, part: GridPart, cap: number): Array<Record<string, string>> {
  switch (part.kind) {
    case 'points': return part.points
    case 'range': return rangePoints(i, part, cap)
    case 'random': return randomPoints(i, part)
  }
}

/** All cases of the grid; throws GridError listing up to maxIssues domain errors, or when over the cap. */
export function expandGrid(functionId: string, grid: Grid, opts: ExpandOptions = {}): GridCase[] {
  const cap = opts.cap ?? MAX_CASES
  const maxIssues = opts.maxIssues ?? 20
  if (!isFunctionId(functionId)) throw new GridError(`Unknown function '${functionId}'.`)
  const defaults = CATALOGUE[functionId].parameters.filter(p => p.default !== undefined)
  const seen = new Set<string>()
  const cases: GridCase[] = []
  const issues: GridIssue[] = []
  let bad = 0
  grid.parts.forEach((part, i) => {
    partPoints(i, part, cap).forEach((raw, j) => {
      const inputs: Record<string, string> = {}
      for (const [k, v] of Object.entries(raw)) inputs[k] = v.trim()
      for (const d of defaults) if (inputs[d.name] === undefined) inputs[d.name] = d.default!
      try {
        validateParams(functionId, inputs)
      } catch (e) {
        bad++
        if (issues.length < maxIssues) issues.push({ part: i, point: j, param: (e as { param?: string }).param, message: (e as Error).message })
        return
      }
      const key = inputKey(inputs, functionId)
      if (seen.has(key)) return
      if (key.length > 255) throw new GridError(`Part ${i + 1}, point ${j + 1}: the inputs are too long to store as a key (at most 255 characters).`, [{ part: i, point: j, message: 'key too long' }])
      seen.add(key)
      if (cases.length >= cap) throw new GridError(`The grid has more than ${cap.toLocaleString('en')} cases; split it into several sets or thin the grid.`, [{ part: i, message: 'over the cap' }])
      cases.push({ ordinal: cases.length, inputs, key })
    })
  })
  if (bad > 0) {
    const head = issues.map(s => `part ${s.part + 1}, point ${s.point! + 1}: ${s.message}`).join('; ')
    throw new GridError(`${bad} grid point${bad === 1 ? '' : 's'} lie outside the domain of ${functionId}: ${head}${bad > issues.length ? '; …' : ''}`, issues)
  }
  return cases
}

export interface SetCase extends GridCase { region: string }

/** The cases of a whole definition, each with its criterion region (errors in region expressions surface here). */
export function expandReferenceSet(def: Pick<ReferenceSetDefinition, 'functionId' | 'grid' | 'criterion'>, opts: ExpandOptions = {}): SetCase[] {
  return expandGrid(def.functionId, def.grid, opts).map(c => ({ ...c, region: regionOf(def.criterion, c.inputs) }))
}
