import { describe, expect, it } from 'vitest'
import { sortVersions } from '../../../shared/domain/versions'

// Ordering rules: semantic-version precedence (semver.org §11, common practice), then creation order.
const v = (label: string, id: number, day = id) => ({ label, id, createdAt: new Date(Date.UTC(2026, 0, day)) })

describe('version ordering', () => {
  it.each([
    [['1.10.0', '1.2.0', '1.9.3'], ['1.2.0', '1.9.3', '1.10.0']],
    [['2.0.0', '2.0.0-rc.1', '2.0.0-beta.2', '2.0.0-beta.10'], ['2.0.0-beta.2', '2.0.0-beta.10', '2.0.0-rc.1', '2.0.0']],
    [['v3.1', 'v3.0.9'], ['v3.0.9', 'v3.1']],
    [['1.0.0-alpha', '1.0.0-alpha.1', '1.0.0-1'], ['1.0.0-1', '1.0.0-alpha', '1.0.0-alpha.1']],
  ])('sorts %j as %j', (input, expected) => {
    expect(sortVersions(input.map((l, i) => v(l, i + 1))).map(x => x.label)).toEqual(expected)
  })

  it('puts non-semantic labels after semantic ones, by creation', () => {
    const list = [v('nightly-b', 1, 5), v('1.0.0', 2, 9), v('nightly-a', 3, 7)]
    expect(sortVersions(list).map(x => x.label)).toEqual(['1.0.0', 'nightly-b', 'nightly-a'])
  })
})
