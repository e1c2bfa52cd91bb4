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

/** The same buckets, with the matched rows as one array: rowOfCase[caseIndex] is the judged row, or −1 (missing). */
export interface KeyMatch {
  rowOfCase: Int32Array
  duplicate: MatchResult['duplicate']
  unexpected: MatchResult['unexpected']
}

/**
 * Match `rowCount` rows, known by their keys, to cases; `keyOf(rowIndex)`
 * gives a row's key from inputKey, or throws when its inputs can't be read.
 * Keys are asked for one row at a time, so rows need not exist as objects.
 */
export function matchByKey(cases: ReadonlyArray<{ key: string }>, rowCount: number, keyOf: (rowIndex: number) => string): KeyMatch {
  const byKey = new Map<string, number>()
  for (let i = 0; i < cases.length; i++) {
    const k = cases[i]!.key
    if (!byKey.has(k)) byKey.set(k, i)
  }
  const rowOfCase = new Int32Array(cases.length).fill(-1)
  const out: KeyMatch = { rowOfCase, duplicate: [], unexpected: [] }
  for (let rowIndex = 0; rowIndex < rowCount; rowIndex++) {
    let key: string
    try {
      key = keyOf(rowIndex)
    } catch (e) {
      out.unexpected.push({ rowIndex, key: null, reason: `inputs cannot be read: ${(e as Error).message}` })
      continue
    }
    const caseIndex = byKey.get(key)
    if (caseIndex === undefined) {
      out.unexpected.push({ rowIndex, key, reason: 'no case of the set has these inputs' })
      continue
    }
    const first = rowOfCase[caseIndex]!
    if (first >= 0) out.duplicate.push({ caseIndex, rowIndex, firstRowIndex: first })
    else rowOfCase[caseIndex] = rowIndex
  }
  return out
}

/** Match rows to cases; `cases[i].key` must come from inputKey(inputs, functionId). */
export function matchRows(cases: ReadonlyArray<{ key: string }>, rows: ReadonlyArray<{ inputs: Record<string, string> }>, functionId: string): MatchResult {
  const m = matchByKey(cases, rows.length, i => inputKey(rows[i]!.inputs, functionId))
  const out: MatchResult = { matched: [], duplicate: m.duplicate, missing: [], unexpected: m.unexpected }
  m.rowOfCase.forEach((rowIndex, caseIndex) => {
    if (rowIndex < 0) out.missing.push(caseIndex)
    else out.matched.push({ caseIndex, rowIndex })
  })
  return out
}
