import { describe, expect, it } from 'vitest'
import { cellState, failures } from '../../../shared/domain/board'
import { sectionsFor } from '../../../shared/domain/navigation'

describe('board cell state', () => {
  it.each([
    [null, 1, 'unverified'],
    [{ revision: 1, counts: { pass: 10 } }, 1, 'passed'],
    [{ revision: 1, counts: { pass: 9, fail: 1 } }, 1, 'failed'],
    [{ revision: 1, counts: { pass: 9, missing: 1 } }, 1, 'failed'],
    [{ revision: 1, counts: { pass: 9, accepted: 1 } }, 1, 'accepted'],
    [{ revision: 1, counts: { pass: 10 } }, 2, 'stale'],
  ] as const)('%j against revision %i is %s', (run, current, state) => {
    expect(cellState(run, current)).toBe(state)
  })

  it('counts every failing verdict kind', () => {
    expect(failures({ pass: 3, fail: 1, missing: 2, unexpected: 1, non_finite: 1, duplicate: 1, accepted: 4 })).toBe(6)
  })
})

describe('navigation by role', () => {
  it.each([
    ['admin', ['Board', 'Reference sets', 'Codes', 'Deviations', 'Submit', 'Audit trail', 'Admin']],
    ['qa', ['Board', 'Reference sets', 'Codes', 'Deviations', 'Submit']],
    ['owner', ['Board', 'Reference sets', 'Codes', 'Deviations']],
    ['viewer', ['Board', 'Reference sets', 'Codes', 'Deviations', 'Audit trail']],
  ] as const)('%s sees %j', (role, labels) => {
    expect(sectionsFor(role).map(s => s.label)).toEqual(labels)
  })
  it('shows nothing to an anonymous visitor', () => {
    expect(sectionsFor(undefined)).toEqual([])
  })
})
