/**
 * Matching rows to cases by canonical input key: missing cases, unexpected
 * rows, duplicates (the first row in file order is judged), and spellings
 * that differ but name the same exact inputs.
 */
import { describe, expect, it } from 'vitest'
import { matchRows } from '../../../shared/compare/match'
import { expandGrid } from '../../../shared/grid/index'

const cases = expandGrid('hermite', { parts: [{ kind: 'points', points: [{ n: '2', x: '0.5' }, { n: '2', x: '1' }, { n: '3', x: '0.5' }, { n: '3', x: '1' }] }] })

describe('matchRows', () => {
  const rows: Array<{ inputs: Record<string, string> }> = [
    { inputs: { n: '3', x: '1.000' } }, // row 0 → case 3
    { inputs: { n: '2', x: '5e-1' } }, // row 1 → case 0
    { inputs: { n: '2.0', x: '0.50' } }, // row 2: duplicate of case 0
    { inputs: { n: '7', x: '0.5' } }, // row 3: no such case
    { inputs: { n: '2', x: 'abc' } }, // row 4: unreadable inputs
    { inputs: { n: '3', x: '1' } }, // row 5: duplicate of case 3
    { inputs: { n: '3', x: '0.5', y: '1' } }, // row 6: extra parameter, no such case
  ]
  const m = matchRows(cases, rows, 'hermite')

  it('matches the first row of each case, in case order', () => {
    expect(m.matched).toEqual([{ caseIndex: 0, rowIndex: 1 }, { caseIndex: 3, rowIndex: 0 }])
  })
  it('lists later rows for a matched case as duplicates, pointing at the judged row', () => {
    expect(m.duplicate).toEqual([{ caseIndex: 0, rowIndex: 2, firstRowIndex: 1 }, { caseIndex: 3, rowIndex: 5, firstRowIndex: 0 }])
  })
  it('lists cases without a row as missing', () => {
    expect(m.missing).toEqual([1, 2])
  })
  it('lists rows that match no case as unexpected, with a reason', () => {
    expect(m.unexpected.map(u => [u.rowIndex, u.key])).toEqual([[3, 'n=7;x=0.5'], [4, null], [6, 'n=3;x=0.5;y=1']])
    expect(m.unexpected[1]!.reason).toMatch(/^inputs cannot be read: x: 'abc' is not a decimal number/)
    expect(m.unexpected[0]!.reason).toBe('no case of the set has these inputs')
  })
  it('accounts for every case and every row exactly once', () => {
    expect(m.matched.length + m.missing.length).toBe(cases.length)
    expect(m.matched.length + m.duplicate.length + m.unexpected.length).toBe(rows.length)
  })
})

describe('empty inputs', () => {
  it('no rows: every case is missing', () => {
    expect(matchRows(cases, [], 'hermite')).toEqual({ matched: [], duplicate: [], missing: [0, 1, 2, 3], unexpected: [] })
  })
  it('no cases: every row is unexpected', () => {
    expect(matchRows([], [{ inputs: { n: '1', x: '1' } }], 'hermite').unexpected).toHaveLength(1)
  })
})
