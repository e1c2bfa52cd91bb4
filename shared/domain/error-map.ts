/**
 * Binning a large error map. A run of 100,000 cases cannot be drawn as
 * 100,000 SVG cells, so past a limit the plane is cut into a regular grid
 * (at most `columns` × `rows`) and each grid cell shows its worst case, so a
 * single failure still shows. Worst means (our rule, as in the run summary):
 * non-finite, then fail, then missing, then accepted, then the rest; within a
 * rank, the larger log10 error.
 */
import type { Verdict } from './enums'
import type { ErrorMap, ErrorMapPoint } from './api-types'

const RANK: Partial<Record<Verdict, number>> = { non_finite: 5, fail: 4, missing: 3, accepted: 2, duplicate: 1 }
const FAILING = new Set<Verdict>(['fail', 'non_finite', 'missing', 'duplicate', 'unexpected'])

const worse = (a: ErrorMapPoint, b: ErrorMapPoint) => {
  const ra = RANK[a.verdict] ?? 0
  const rb = RANK[b.verdict] ?? 0
  if (ra !== rb) return ra > rb
  return (a.log10 ?? Infinity) > (b.log10 ?? Infinity)
}

export const MAP_CELL_LIMIT = 8000

export function binErrorMap(map: ErrorMap, limit = MAP_CELL_LIMIT, columns = 160, rows = 50): ErrorMap {
  if (map.points.length <= limit) return map
  const span = (values: number[]) => {
    let lo = Infinity
    let hi = -Infinity
    for (const v of values) if (Number.isFinite(v)) {
      lo = Math.min(lo, v)
      hi = Math.max(hi, v)
    }
    return Number.isFinite(lo) ? { lo, hi } : { lo: 0, hi: 0 }
  }
  const distinct = (values: number[]) => new Set(values).size
  const xs = map.points.map(p => p.x)
  const ys = map.points.map(p => p.y)
  const cols = Math.max(1, Math.min(columns, distinct(xs)))
  const rws = map.yParam === null ? 1 : Math.max(1, Math.min(rows, distinct(ys)))
  const sx = span(xs)
  const sy = span(ys)
  const wx = (sx.hi - sx.lo) / cols || 1
  const wy = (sy.hi - sy.lo) / rws || 1
  const cell = (v: number, s: { lo: number }, w: number, n: number) => Math.min(n - 1, Math.max(0, Math.floor((v - s.lo) / w)))
  const bins = new Map<number, { worst: ErrorMapPoint, cases: number, failing: number, i: number, j: number }>()
  for (const p of map.points) {
    const i = cell(p.x, sx, wx, cols)
    const j = map.yParam === null ? 0 : cell(p.y, sy, wy, rws)
    const k = j * cols + i
    const b = bins.get(k)
    const fails = FAILING.has(p.verdict) ? 1 : 0
    if (!b) bins.set(k, { worst: p, cases: 1, failing: fails, i, j })
    else {
      b.cases++
      b.failing += fails
      if (worse(p, b.worst)) b.worst = p
    }
  }
  const points = [...bins.values()].map(b => ({
    ...b.worst,
    x: sx.lo + (b.i + 0.5) * wx,
    y: map.yParam === null ? b.worst.y : sy.lo + (b.j + 0.5) * wy,
    cases: b.cases,
    failing: b.failing,
    caseX: b.worst.x,
    caseY: b.worst.y,
  }))
  return { ...map, points, binned: { cases: map.points.length, columns: cols, rows: rws } }
}
