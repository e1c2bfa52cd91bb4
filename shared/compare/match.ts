/**
 * Matching a solver's parsed rows to the set's cases by canonical input key
 * (shared/grid/keys.ts). Every case and every row ends in exactly one bucket:
 *
 * - matched:    the first row (in file order) for a case; this row is judged.
 * - duplicate:  any later row for an already matched case. It is recorded
 *               with its measured value but never judged, so a second,
 *               better row cannot improve a verdict (our rule).
 * - missing:    a case with no row.
 * - unexpected: a row whose inputs match no case, or cannot be read as the
 *               function's parameters.
 */
import { inputKey } from '../grid/keys'

export interface MatchResult {
  /** In case order. */
  matched: Array<{ caseIndex: number; rowIndex: number }>
  duplicate: Array<{ caseIndex: number; rowIndex: number; firstRowIndex: number }>
  missing: number[]
  unexpected: Array<{ rowIndex: number; key: string | null; reason: string }>
}

/** Match rows to cases; `cases[i].key` must come from inputKey(inputs, functionId). */
export function matchRows(cases: ReadonlyArray<{ key: string }>, rows: ReadonlyArray<{ inputs: Record<string, string> }>, functionId: string): MatchResult {
  const byKey = new Map<string, number>()
  cases.forEach((c, i) => { if (!byKey.has(c.key)) byKey.set(c.key, i) })
  const firstRow = new Int32Array(cases.length).fill(-1)
  const out: MatchResult = { matched: [], duplicate: [], missing: [], unexpected: [] }
  rows.forEach((row, rowIndex) => {
    let key: string
    try {
      key = inputKey(row.inputs, functionId)
    } catch (e) {
      out.unexpected.push({ rowIndex, key: null, reason: `inputs cannot be read: ${(e as Error).message}` })
      return
    }
    const caseIndex = byKey.get(key)
    if (caseIndex === undefined) {
      out.unexpected.push({ rowIndex, key, reason: 'no case of the set has these inputs' })
      return
    }
    const first = firstRow[caseIndex]!
    if (first >= 0) out.duplicate.push({ caseIndex, rowIndex, firstRowIndex: first })
    else firstRow[caseIndex] = rowIndex
  })
  firstRow.forEach((rowIndex, caseIndex) => {
    if (rowIndex < 0) out.missing.push(caseIndex)
    else out.matched.push({ caseIndex, rowIndex })
  })
  return out
}
