// The reference-set form's working copy (strings as typed) and its
// conversion to a ReferenceSetInput for the shared zod schema, plus the
// reverse, so "Edit as new revision" can start from a saved definition.
import type { ReferenceSetDefinition, ReferenceSetInput } from '#shared/schemas/reference-set'
import type { ConditionOp, Tolerance } from '#shared/schemas/criterion'
import { CATALOGUE, type FunctionId } from '#shared/reference/catalogue'

export type ToleranceKind = Tolerance['kind']
export interface ToleranceDraft { kind: ToleranceKind, atol: string, rtol: string, maxUlps: string, k: string, kappaFloor: string }
export interface RangeAxisDraft { param: string, mode: 'range' | 'list', start: string, stop: string, step: string, values: string }
export interface RandomAxisDraft { param: string, min: string, max: string, places: string }
export type PartDraft =
  | { kind: 'range', axes: RangeAxisDraft[] }
  | { kind: 'points', columns: string, text: string }
  | { kind: 'random', seed: string, count: string, axes: RandomAxisDraft[], fixed: Record<string, string> }
export interface ConditionDraft { param: string, op: ConditionOp, value: string }
export interface RegionDraft { name: string, when: ConditionDraft[], tolerance: ToleranceDraft }
export interface CriterionDraft {
  format: 'binary32' | 'binary64' | 'binary128'
  tolerance: ToleranceDraft
  regions: RegionDraft[]
  zeroBelow: string
  zeroAtol: string
  signedInf: 'pass' | 'fail'
  nan: 'non_finite' | 'fail'
}
export interface ReferenceSetDraft {
  name: string
  slug: string
  functionId: FunctionId
  output: string
  convention: string
  parts: PartDraft[]
  targetDigits: string
  criterion: CriterionDraft
  source: string
  notes: string
}

/** A short convention name per function, offered as the starting value. */
export const DEFAULT_CONVENTION: Record<FunctionId, string> = {
  'hermite': 'physicists',
  'hermite-prob': 'probabilists',
  'hermite-function': 'orthonormal (physicists)',
  'hermite-derivative': 'physicists',
  'gauss-hermite': 'by weight parameter',
  'hermite-series': 'y(0) = 1 / y′(0) = 1',
  'kummer': 'unregularised 1F1',
  'parabolic-cylinder': 'Whittaker D_nu',
}

export const blankTolerance = (kind: ToleranceKind = 'ulps', maxUlps = '4'): ToleranceDraft =>
  ({ kind, atol: '0', rtol: '1e-14', maxUlps, k: '4', kappaFloor: '1' })

export function numericParams(id: FunctionId) {
  return CATALOGUE[id].parameters.filter(p => p.kind !== 'choice')
}

export function rangeAxis(param: string): RangeAxisDraft {
  return { param, mode: 'range', start: '0', stop: '10', step: '1', values: '' }
}

export function blankPart(kind: PartDraft['kind'], id: FunctionId): PartDraft {
  const params = CATALOGUE[id].parameters
  if (kind === 'points') return { kind, columns: params.map(p => p.name).join(','), text: '' }
  if (kind === 'random') {
    const fixed: Record<string, string> = {}
    for (const p of params) if (p.kind === 'choice') fixed[p.name] = p.default ?? p.choices?.[0] ?? ''
    return {
      kind, seed: '1', count: '100', fixed,
      axes: numericParams(id).map(p => ({ param: p.name, min: p.kind === 'integer' ? '0' : '-1', max: p.kind === 'integer' ? '10' : '1', places: p.kind === 'integer' ? '0' : '3' })),
    }
  }
  return {
    kind,
    axes: params.map(p => p.kind === 'choice'
      ? { ...rangeAxis(p.name), mode: 'list', values: p.default ?? p.choices?.[0] ?? '' }
      : rangeAxis(p.name)),
  }
}

export function blankDraft(id: FunctionId = 'hermite'): ReferenceSetDraft {
  return {
    name: '', slug: '', functionId: id, output: CATALOGUE[id].outputs[0] ?? '', convention: DEFAULT_CONVENTION[id],
    parts: [blankPart('range', id)], targetDigits: '30',
    criterion: { format: 'binary64', tolerance: blankTolerance(), regions: [], zeroBelow: '0', zeroAtol: '0', signedInf: 'pass', nan: 'non_finite' },
    source: '', notes: '',
  }
}

export function slugFrom(name: string): string {
  return name.toLowerCase().normalize('NFKD').replace(/[\u0300-\u036F]/g, '')
    .replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80).replace(/-+$/, '')
}

function toleranceInput(t: ToleranceDraft): Tolerance {
  switch (t.kind) {
    case 'absolute': return { kind: 'absolute', atol: t.atol }
    case 'relative': return { kind: 'relative', rtol: t.rtol }
    case 'mixed': return { kind: 'mixed', atol: t.atol, rtol: t.rtol }
    case 'ulps': return { kind: 'ulps', maxUlps: t.maxUlps }
    case 'condition': return { kind: 'condition', k: t.k, kappaFloor: t.kappaFloor }
  }
}

function toleranceDraft(t: Tolerance): ToleranceDraft {
  return { ...blankTolerance(t.kind), ...t } as ToleranceDraft
}

/** Whole numbers typed as text: '' stays undefined so the schema names the field. */
function int(s: string): number | undefined {
  const t = s.trim()
  return t === '' ? undefined : Number(t)
}

const splitList = (s: string) => s.split(/[,;\s]+/).map(v => v.trim()).filter(Boolean)

/** Issues found while reading the draft, before the schema sees it (e.g. a points line with too few values). */
export interface DraftIssue { field: string, message: string }

export function draftToInput(d: ReferenceSetDraft): { input: ReferenceSetInput, issues: DraftIssue[] } {
  const issues: DraftIssue[] = []
  const parts = d.parts.map((p, i) => {
    if (p.kind === 'range') {
      return {
        kind: 'range' as const,
        axes: p.axes.map(a => a.mode === 'list'
          ? { param: a.param, values: splitList(a.values) }
          : { param: a.param, start: a.start, stop: a.stop, step: a.step }),
      }
    }
    if (p.kind === 'random') {
      const fixed = Object.fromEntries(Object.entries(p.fixed).filter(([, v]) => v !== ''))
      return {
        kind: 'random' as const, seed: int(p.seed) as number, count: int(p.count) as number, fixed,
        axes: p.axes.map(a => ({ param: a.param, min: a.min, max: a.max, places: int(a.places) as number })),
      }
    }
    const columns = splitList(p.columns)
    const points: Record<string, string>[] = []
    p.text.split(/\r?\n/).forEach((line, ln) => {
      const t = line.trim()
      if (!t || t.startsWith('#')) return
      const fields = t.split(/\s*[,;\t]\s*|\s+/).filter(Boolean)
      if (fields.length !== columns.length) {
        issues.push({ field: `grid.parts.${i}.points`, message: `Line ${ln + 1} has ${fields.length} value${fields.length === 1 ? '' : 's'}; expected ${columns.length} (${columns.join(', ')}).` })
      }
      points.push(Object.fromEntries(columns.flatMap((c, j) => (fields[j] === undefined ? [] : [[c, fields[j]]]))))
    })
    return { kind: 'points' as const, points }
  })
  const c = d.criterion
  const input: ReferenceSetInput = {
    name: d.name,
    slug: d.slug,
    functionId: d.functionId,
    ...(CATALOGUE[d.functionId].outputs.length > 1 ? { output: d.output } : {}),
    convention: d.convention,
    grid: { parts },
    targetDigits: int(d.targetDigits) as number,
    criterion: {
      format: c.format,
      tolerance: toleranceInput(c.tolerance),
      regions: c.regions.map(r => ({ name: r.name, when: r.when.map(w => ({ ...w })), tolerance: toleranceInput(r.tolerance) })),
      zero: { below: c.zeroBelow, atol: c.zeroAtol },
      overflow: { signedInf: c.signedInf },
      nan: { verdict: c.nan },
    },
    source: d.source,
    notes: d.notes,
  }
  return { input, issues }
}

export function definitionToDraft(def: ReferenceSetDefinition): ReferenceSetDraft {
  const id = def.functionId
  const parts: PartDraft[] = def.grid.parts.map((p) => {
    if (p.kind === 'range') {
      return {
        kind: 'range',
        axes: p.axes.map(a => 'values' in a
          ? { ...rangeAxis(a.param), mode: 'list' as const, values: a.values.join(', ') }
          : { param: a.param, mode: 'range' as const, start: a.start, stop: a.stop, step: a.step, values: '' }),
      }
    }
    if (p.kind === 'random') {
      return {
        kind: 'random', seed: String(p.seed), count: String(p.count), fixed: { ...p.fixed },
        axes: p.axes.map(a => ({ param: a.param, min: a.min, max: a.max, places: String(a.places) })),
      }
    }
    const columns = [...new Set(p.points.flatMap(pt => Object.keys(pt)))]
    return { kind: 'points', columns: columns.join(','), text: p.points.map(pt => columns.map(c => pt[c] ?? '').join(',')).join('\n') }
  })
  const c = def.criterion
  return {
    name: def.name, slug: def.slug, functionId: id, output: def.output ?? CATALOGUE[id].outputs[0] ?? '',
    convention: def.convention, parts, targetDigits: String(def.targetDigits),
    criterion: {
      format: c.format, tolerance: toleranceDraft(c.tolerance),
      regions: c.regions.map(r => ({ name: r.name, when: r.when.map(w => ({ ...w })), tolerance: toleranceDraft(r.tolerance) })),
      zeroBelow: c.zero.below, zeroAtol: c.zero.atol, signedInf: c.overflow.signedInf, nan: c.nan.verdict,
    },
    source: def.source, notes: def.notes,
  }
}
