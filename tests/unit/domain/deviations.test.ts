import { describe, expect, it } from 'vitest'
import { matchPlan, precedenceOrder, standing, standingForVersion, withAccepted, type DeviationRule } from '../../../shared/domain/deviations'

const v = (label: string, id: number) => ({ label, id, createdAt: new Date(Date.UTC(2026, 0, id)) })
const VERSIONS = [v('2.3.0', 1), v('2.4.0', 2), v('2.4.1', 3), v('nightly', 4)]
const NOW = new Date('2026-06-01T00:00:00Z')
const dev = (over: Partial<DeviationRule>): DeviationRule => ({
  id: 1, scope: 'set', caseInputKey: null, region: null, state: 'approved', expiresAtVersion: null, expiresOn: null, ...over,
})

describe('deviation standing', () => {
  it.each([
    [dev({ state: 'proposed' }), 'proposed'],
    [dev({ state: 'approved' }), 'approved'],
    [dev({ state: 'approved', expiresOn: '2026-05-31T00:00:00Z' }), 'expired'],
    [dev({ state: 'approved', expiresOn: '2026-06-01T00:00:00Z' }), 'expired'],
    [dev({ state: 'approved', expiresOn: '2026-06-02T00:00:00Z' }), 'approved'],
    [dev({ state: 'withdrawn', expiresOn: '2026-05-31T00:00:00Z' }), 'withdrawn'],
    [dev({ state: 'rejected' }), 'rejected'],
  ] as const)('%j is %s', (d, expected) => {
    expect(standing(d, NOW)).toBe(expected)
  })

  it.each([
    ['2.4.1', '2.3.0', 'applies'],
    ['2.4.1', '2.4.0', 'applies'],
    ['2.4.1', '2.4.1', 'expired-by-version'],
    ['2.4.1', 'nightly', 'expired-by-version'], // labels that are not semantic versions come after those that are
    ['3.0.0', '2.4.1', 'applies'], // an expiry version not yet made
    ['2.4.0-rc.1', '2.4.0', 'expired-by-version'], // a release is after its pre-releases
    ['later', 'nightly', 'applies'], // an unknown non-semantic label counts as made after every existing version
  ])('expiring at %s, for version %s: %s', (expiry, label, expected) => {
    const version = VERSIONS.find(x => x.label === label)!
    expect(standingForVersion(dev({ expiresAtVersion: expiry }), version, VERSIONS, NOW)).toBe(expected)
  })

  it('applies only when approved and not past its date', () => {
    expect(standingForVersion(dev({ state: 'proposed' }), VERSIONS[0]!, VERSIONS, NOW)).toBe('not-approved')
    expect(standingForVersion(dev({ expiresOn: '2026-01-01T00:00:00Z' }), VERSIONS[0]!, VERSIONS, NOW)).toBe('expired-by-date')
  })
})

describe('which deviation takes a case', () => {
  const set = dev({ id: 1, scope: 'set' })
  const region = dev({ id: 5, scope: 'region', region: 'large-x' })
  const caseA = dev({ id: 9, scope: 'case', caseInputKey: 'n=12;x=0.5' })
  const caseB = dev({ id: 3, scope: 'case', caseInputKey: 'n=4;x=1' })

  it('orders narrow before wide, then oldest first', () => {
    expect(precedenceOrder([set, region, caseA, caseB]).map(d => d.id)).toEqual([3, 9, 5, 1])
  })

  it('stops the plan at the first set-wide deviation', () => {
    const later = dev({ id: 7, scope: 'set' })
    expect(matchPlan([later, set, caseA, region])).toEqual([
      { deviationId: 9, kind: 'case', inputKey: 'n=12;x=0.5' },
      { deviationId: 5, kind: 'region', region: 'large-x' },
      { deviationId: 1, kind: 'set' },
    ])
  })
})

describe('counts with accepted failures', () => {
  it('moves failures to accepted, never more than there are', () => {
    expect(withAccepted({ pass: 10, fail: 3, non_finite: 1 }, 2)).toEqual({ pass: 10, fail: 1, non_finite: 1, accepted: 2 })
    expect(withAccepted({ pass: 10, fail: 3 }, 5)).toEqual({ pass: 10, fail: 0, accepted: 3 })
    expect(withAccepted({ pass: 10 }, 0)).toEqual({ pass: 10 })
  })
})
