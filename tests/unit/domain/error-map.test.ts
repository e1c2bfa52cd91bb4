import { describe, expect, it } from 'vitest'
import { binErrorMap } from '../../../shared/domain/error-map'
import type { ErrorMap, ErrorMapPoint } from '../../../shared/domain/api-types'

// An invented 100 × 1000 plane (n = 0…99, x = -5…4.99), all passing at log10 ULPs −1,
// except one failing case and one non-finite one.
function plane(): ErrorMap {
  const points: ErrorMapPoint[] = []
  let id = 1
  for (let n = 0; n < 100; n++) {
    for (let i = -500; i < 500; i++) points.push({ x: i / 100, y: n, log10: -1, verdict: 'pass', caseId: id++ })
  }
  points[12345] = { ...points[12345]!, verdict: 'fail', log10: 2.5 }
  points[54321] = { ...points[54321]!, verdict: 'non_finite', log10: null }
  return { xParam: 'x', yParam: 'n', metric: 'ulps', points }
}

describe('binErrorMap', () => {
  it('leaves a small map alone', () => {
    const small: ErrorMap = { xParam: 'x', yParam: 'n', metric: 'ulps', points: plane().points.slice(0, 500) }
    expect(binErrorMap(small)).toBe(small)
  })

  it('cuts a large map into a bounded grid that still shows each failure', () => {
    const map = plane()
    const binned = binErrorMap(map, 8000, 160, 50)
    expect(binned.binned).toEqual({ cases: 100_000, columns: 160, rows: 50 })
    expect(binned.points.length).toBeLessThanOrEqual(160 * 50)
    expect(binned.points.reduce((s, p) => s + p.cases!, 0)).toBe(100_000)
    const fail = binned.points.find(p => p.verdict === 'fail')!
    expect(fail).toMatchObject({ caseId: map.points[12345]!.caseId, caseX: map.points[12345]!.x, caseY: map.points[12345]!.y, failing: 1 })
    const nonFinite = binned.points.find(p => p.verdict === 'non_finite')!
    expect(nonFinite.caseId).toBe(map.points[54321]!.caseId)
    expect(binned.points.filter(p => p.verdict !== 'pass')).toHaveLength(2)
    // cell centres lie inside the plane
    for (const p of binned.points) {
      expect(p.x).toBeGreaterThan(-5)
      expect(p.x).toBeLessThan(4.99)
      expect(p.y).toBeGreaterThan(0)
      expect(p.y).toBeLessThan(99)
    }
  })

  it('bins a one-parameter map along x only, keeping each cell’s worst value', () => {
    const points: ErrorMapPoint[] = Array.from({ length: 20_000 }, (_, i) => ({ x: i, y: 0, log10: (i % 7) - 3, verdict: 'pass', caseId: i + 1 }))
    const binned = binErrorMap({ xParam: 'n', yParam: null, metric: 'ulps', points }, 8000, 100, 50)
    expect(binned.binned).toEqual({ cases: 20_000, columns: 100, rows: 1 })
    expect(binned.points).toHaveLength(100)
    expect(binned.points.every(p => p.log10 === 3)).toBe(true)
  })
})
