/**
 * The reference-set definition schema (shared by the form and the server):
 * a valid definition with every grid part and a region, and the issues it
 * reports, each on the field it concerns. The scenario is invented: a QA
 * team checking an in-house oscillator library.
 */
import { describe, expect, it } from 'vitest'
import { referenceSetSchema, type ReferenceSetInput } from '../../../shared/schemas/reference-set'

const valid: ReferenceSetInput = {
  name: 'Oscillator basis, physicists’ H_n up to degree 60',
  slug: 'osc-basis-h60',
  functionId: 'hermite',
  convention: 'physicists’ H_n, weight e^{-x^2}',
  grid: {
    parts: [
      { kind: 'points', points: [{ n: '0', x: '0' }, { n: '7', x: '-2.25' }] },
      { kind: 'range', axes: [{ param: 'n', start: '0', stop: '60', step: '5' }, { param: 'x', start: '-8', stop: '8', step: '0.25' }] },
      { kind: 'random', seed: 4242, count: 500, axes: [{ param: 'n', min: '0', max: '60', places: 0 }, { param: 'x', min: '-10', max: '10', places: 4 }] },
    ],
  },
  targetDigits: 30,
  criterion: {
    format: 'binary64',
    tolerance: { kind: 'ulps', maxUlps: '4' },
    regions: [{ name: 'tail', when: [{ param: 'x', op: 'absGreaterThan', value: 'sqrt(2*n+1)' }], tolerance: { kind: 'ulps', maxUlps: '64' } }],
    zero: { below: '1e-300', atol: '1e-300' },
    overflow: { signedInf: 'pass' },
  },
  source: 'Computed in-house by the Plumbline engine.',
}

const issues = (patch: (d: ReferenceSetInput) => void) => {
  const d = structuredClone(valid)
  patch(d)
  const r = referenceSetSchema.safeParse(d)
  return r.success ? [] : r.error.issues.map(i => [i.path.join('.'), i.message])
}

describe('referenceSetSchema', () => {
  it('accepts a full definition and fills the stated defaults', () => {
    const d = referenceSetSchema.parse(valid)
    expect(d.criterion.nan).toEqual({ verdict: 'non_finite' })
    expect(d.notes).toBe('')
    expect(d.grid.parts[2]).toMatchObject({ kind: 'random', fixed: {} })
  })

  it.each<[string, (d: ReferenceSetInput) => void, string, RegExp]>([
    ['target digits below 15', d => { d.targetDigits = 14 }, 'targetDigits', /^Target digits must be from 15 to 100\.$/],
    ['target digits above 100', d => { d.targetDigits = 101 }, 'targetDigits', /^Target digits must be from 15 to 100\.$/],
    ['fractional target digits', d => { d.targetDigits = 20.5 }, 'targetDigits', /whole number/],
    ['an unknown function', d => { d.functionId = 'airy' as never }, 'functionId', /Choose a function/],
    ['a bad slug', d => { d.slug = 'Osc Basis' }, 'slug', /lower-case/],
    ['an unknown parameter in a point', d => { (d.grid.parts[0] as { points: Array<Record<string, string>> }).points[0]!.y = '1' }, 'grid.parts.0.points.0.y', /hermite has no parameter 'y'/],
    ['a non-decimal range bound', d => { (d.grid.parts[1] as { axes: Array<{ start: string }> }).axes[0]!.start = 'zero' }, 'grid.parts.1.axes.0.start', /decimal number/],
    ['a repeated axis', d => { (d.grid.parts[1] as { axes: Array<{ param: string }> }).axes[1]!.param = 'n' }, 'grid.parts.1.axes', /one axis only/],
    ['an unknown name in a region', d => { d.criterion.regions![0]!.when[0]!.value = 'sqrt(2*m+1)' }, 'criterion.regions.0.when.0.value', /Unknown name 'm'/],
    ['a malformed region expression', d => { d.criterion.regions![0]!.when[0]!.value = 'sqrt(2n+1)' }, 'criterion.regions.0.when.0.value', /Expected '\)' at column 7/],
    ['a garbage tolerance', d => { d.criterion.tolerance = { kind: 'relative', rtol: 'tiny' } }, 'criterion.tolerance.rtol', /non-negative decimal/],
    ['a region named all', d => { d.criterion.regions![0]!.name = 'all' }, 'criterion.regions.0.name', /default region/],
    ['a negative tolerance', d => { d.criterion.tolerance = { kind: 'ulps', maxUlps: '-1' } }, 'criterion.tolerance.maxUlps', /non-negative/],
    ['a missing zero rule', d => { delete (d.criterion as { zero?: unknown }).zero }, 'criterion.zero', /object/i],
    ['a missing overflow rule', d => { delete (d.criterion as { overflow?: unknown }).overflow }, 'criterion.overflow', /object/i],
    ['a tolerance finer than the digits settle', d => { d.targetDigits = 15 }, 'targetDigits', /Raise the target digits to at least 18/],
    ['an output the function lacks', d => { d.output = 'weight' }, 'output', /hermite outputs value/],
  ])('refuses %s', (_what, patch, path, msg) => {
    const found = issues(patch)
    expect(found.length).toBeGreaterThan(0)
    expect(found).toContainEqual([path, expect.stringMatching(msg)])
  })

  it('refuses duplicate region names', () => {
    expect(issues(d => { d.criterion.regions = [d.criterion.regions![0]!, d.criterion.regions![0]!] })).toContainEqual(['criterion.regions.1.name', "Region name 'tail' is used twice."])
  })

  it('lets a choice parameter be compared with equals only', () => {
    const gh = (op: 'equals' | 'lessThan') => referenceSetSchema.safeParse({
      ...valid, functionId: 'gauss-hermite', grid: { parts: [{ kind: 'points', points: [{ n: '5', i: '1' }] }] },
      criterion: { ...valid.criterion, regions: [{ name: 'prob', when: [{ param: 'weight', op, value: 'probabilists' }], tolerance: { kind: 'ulps', maxUlps: '8' } }] },
    })
    expect(gh('equals').success).toBe(true)
    expect(gh('lessThan').error!.issues.map(i => i.message)).toContain("'weight' is a choice; use equals or notEquals.")
  })
})
