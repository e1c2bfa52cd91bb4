/**
 * Grid expansion: exact ranges (no drift), cartesian order, seeded random
 * points (pinned against the C reference run, prng-vectors.c), unions,
 * dedupe by canonical key, the cap, and domain errors from the engine's
 * validateParams (domains from shared/reference/catalogue.ts).
 */
import { describe, expect, it } from 'vitest'
import { expandGrid, expandReferenceSet, GridError } from '../../../shared/grid/index'
import { gridSchema, type Grid } from '../../../shared/schemas/reference-set'
import { criterionSchema } from '../../../shared/schemas/criterion'

const grid = (parts: unknown[]): Grid => gridSchema.parse({ parts })
const xs = (g: Grid, id = 'hermite') => expandGrid(id, g).map(c => c.inputs.x)

describe('ranges', () => {
  it('0 to 1 by 0.1 gives eleven exact values, 0.3 and the stop included', () => {
    expect(xs(grid([{ kind: 'range', axes: [{ param: 'n', values: ['2'] }, { param: 'x', start: '0', stop: '1', step: '0.1' }] }])))
      .toEqual(['0', '0.1', '0.2', '0.3', '0.4', '0.5', '0.6', '0.7', '0.8', '0.9', '1'])
  })

  it.each([
    // [start, stop, step, count, last]: exact counts where binary64 steps would drift.
    ['0', '1', '0.1', 11, '1'],
    ['-1', '1', '0.001', 2001, '1'],
    ['0', '0.3', '0.1', 4, '0.3'],
    ['0', '1', '0.3', 4, '0.9'],
    ['1e-3', '2e-3', '1e-4', 11, '0.002'],
    ['5', '5', '1', 1, '5'],
  ])('start %s stop %s step %s → %i values ending at %s', (start, stop, step, count, last) => {
    const v = xs(grid([{ kind: 'range', axes: [{ param: 'n', values: ['1'] }, { param: 'x', start, stop, step }] }]))
    expect(v).toHaveLength(count)
    expect(v[v.length - 1]).toBe(last)
  })

  it('is a cartesian product with the last axis fastest', () => {
    const cs = expandGrid('hermite', grid([{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '2', step: '1' }, { param: 'x', values: ['-1', '1'] }] }]))
    expect(cs.map(c => `${c.inputs.n},${c.inputs.x}`)).toEqual(['0,-1', '0,1', '1,-1', '1,1', '2,-1', '2,1'])
    expect(cs.map(c => c.ordinal)).toEqual([0, 1, 2, 3, 4, 5])
  })

  it.each([
    ['0', '1', '0', /greater than zero/],
    ['0', '1', '-0.1', /greater than zero/],
    ['1', '0', '0.1', /after its stop/],
  ])('refuses start %s stop %s step %s', (start, stop, step, msg) => {
    expect(() => expandGrid('hermite', grid([{ kind: 'range', axes: [{ param: 'n', values: ['1'] }, { param: 'x', start, stop, step }] }]))).toThrow(msg)
  })
})

describe('seeded random points', () => {
  const part = { kind: 'random', seed: 7, count: 5, axes: [{ param: 'n', min: '0', max: '50', places: 0 }, { param: 'x', min: '-1', max: '1', places: 3 }] }

  it('match the C reference run (prng-vectors.c, seed 7)', () => {
    const cs = expandGrid('hermite', grid([part]))
    expect(cs.map(c => `n=${c.inputs.n},x=${c.inputs.x}`)).toEqual(['n=26,x=-0.259', 'n=44,x=0.711', 'n=30,x=-0.506', 'n=49,x=-0.849', 'n=6,x=-0.221'])
  })

  it('are reproducible and keep the stated decimal places', () => {
    const big = { ...part, seed: 123456789, count: 2000 }
    const a = expandGrid('hermite', grid([big]))
    const b = expandGrid('hermite', grid([big]))
    expect(a).toEqual(b)
    for (const c of a) {
      expect(c.inputs.x).toMatch(/^-?[01]\.\d{3}$/)
      expect(Math.abs(Number(c.inputs.x))).toBeLessThanOrEqual(1)
      expect(c.inputs.n).toMatch(/^\d+$/)
    }
    expect(expandGrid('hermite', grid([{ ...big, seed: 123456790 }]))).not.toEqual(a)
  })

  it('refuses bounds with more places than stated', () => {
    expect(() => expandGrid('hermite', grid([{ ...part, axes: [{ param: 'n', min: '0', max: '5', places: 0 }, { param: 'x', min: '0.25', max: '1', places: 1 }] }]))).toThrow(/more than 1 decimal places/)
  })
})

describe('unions and dedupe', () => {
  it('keeps the first spelling of a point and the order of the parts', () => {
    const cs = expandGrid('hermite', grid([
      { kind: 'points', points: [{ n: '3', x: '0.50' }, { n: '3', x: '2' }] },
      { kind: 'points', points: [{ n: '3', x: '0.5' }, { n: '3.0', x: '5e-1' }, { n: '4', x: '0.5' }] },
      { kind: 'range', axes: [{ param: 'n', values: ['3'] }, { param: 'x', start: '0', stop: '1', step: '0.5' }] },
    ]))
    expect(cs.map(c => `${c.inputs.n},${c.inputs.x}`)).toEqual(['3,0.50', '3,2', '4,0.5', '3,0', '3,1'])
    expect(cs.map(c => c.key)).toEqual(['n=3;x=0.5', 'n=3;x=2', 'n=4;x=0.5', 'n=3;x=0', 'n=3;x=1'])
  })

  it('fills catalogue defaults (Gauss–Hermite weight) so rows without them still match', () => {
    const cs = expandGrid('gauss-hermite', grid([{ kind: 'points', points: [{ n: '5', i: '1' }, { n: '5', i: '1', weight: 'physicists' }, { n: '5', i: '1', weight: 'probabilists' }] }]))
    expect(cs.map(c => c.inputs.weight)).toEqual(['physicists', 'probabilists'])
  })
})

describe('the cap', () => {
  it('refuses a range part larger than the cap before building it', () => {
    expect(() => expandGrid('hermite', grid([{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '999', step: '1' }, { param: 'x', start: '-1', stop: '1', step: '0.001' }] }])))
      .toThrow(/2001000 points, more than the limit of 200000/)
  })

  it('refuses a union whose distinct cases pass the cap, counting after dedupe', () => {
    // 20 points, then 20 more of which 10 are new: 30 distinct cases.
    const g = grid([
      { kind: 'range', axes: [{ param: 'n', start: '0', stop: '9', step: '1' }, { param: 'x', values: ['0', '1'] }] },
      { kind: 'range', axes: [{ param: 'n', start: '0', stop: '9', step: '1' }, { param: 'x', values: ['1.0', '2'] }] },
    ])
    expect(expandGrid('hermite', g, { cap: 30 })).toHaveLength(30)
    expect(() => expandGrid('hermite', g, { cap: 29 })).toThrow(/^The grid has more than 29 cases; split it/)
  })
})

describe('domain errors', () => {
  it.each([
    [{ n: '-1', x: '0' }, /n must be an integer from 0 to 20000/],
    [{ n: '1.5', x: '0' }, /n must be an integer/],
    [{ n: '3', x: '2e6' }, /x must lie in \[-1000000, 1000000\]/],
    [{ n: '3' }, /missing parameter 'x'/],
    [{ n: '3', x: '1', y: '2' }, /unknown parameter 'y'/],
  ])('%j is refused', (point, msg) => {
    expect(() => expandGrid('hermite', grid([{ kind: 'points', points: [point] }]))).toThrow(msg)
  })

  it('lists every bad point (up to the limit) with part and point numbers', () => {
    try {
      expandGrid('hermite', grid([{ kind: 'points', points: [{ n: '1', x: '0' }, { n: '-1', x: '0' }, { n: '-2', x: '0' }] }]), { maxIssues: 1 })
      expect.unreachable()
    } catch (e) {
      expect(e).toBeInstanceOf(GridError)
      expect((e as GridError).message).toMatch(/^2 grid points lie outside the domain of hermite: part 1, point 2: .*; …$/)
      expect((e as GridError).issues).toEqual([{ part: 0, point: 1, param: 'n', message: 'n must be an integer from 0 to 20000' }])
    }
  })

  it('refuses an unknown function', () => {
    expect(() => expandGrid('airy', grid([{ kind: 'points', points: [{ x: '1' }] }]))).toThrow(/Unknown function 'airy'/)
  })
})

describe('expandReferenceSet', () => {
  it('stores each case with its criterion region', () => {
    const criterion = criterionSchema.parse({
      tolerance: { kind: 'ulps', maxUlps: '4' },
      regions: [{ name: 'tail', when: [{ param: 'x', op: 'absGreaterThan', value: 'sqrt(2*n+1)' }], tolerance: { kind: 'ulps', maxUlps: '64' } }],
      zero: { below: '0', atol: '0' }, overflow: { signedInf: 'fail' },
    })
    const cs = expandReferenceSet({ functionId: 'hermite', criterion, grid: grid([{ kind: 'range', axes: [{ param: 'n', values: ['4'] }, { param: 'x', values: ['-3.5', '-3', '0', '3', '3.001'] }] }]) })
    expect(cs.map(c => c.region)).toEqual(['tail', 'all', 'all', 'all', 'tail'])
  })
})
