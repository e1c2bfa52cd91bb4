// A reference set's definition written out in plain words, for the set page
// and the form's summary. The bounds follow shared/compare/criterion.ts.
import type { Criterion, ConditionOp, RegionCondition, Tolerance } from '#shared/schemas/criterion'
import type { GridPart } from '#shared/schemas/reference-set'

export const OP_WORDS: Record<ConditionOp, string> = {
  lessThan: '<', atMost: '≤', greaterThan: '>', atLeast: '≥', equals: '=', notEquals: '≠',
  absLessThan: '|·| <', absAtMost: '|·| ≤', absGreaterThan: '|·| >', absAtLeast: '|·| ≥',
}

export const FORMAT_WORDS: Record<Criterion['format'], string> = {
  binary32: 'binary32 (single, p = 24)',
  binary64: 'binary64 (double, p = 53)',
  binary128: 'binary128 (quadruple, p = 113)',
}

export function useReferenceSetText() {
  function tolerance(t: Tolerance, format: Criterion['format']): string {
    switch (t.kind) {
      case 'absolute': return `absolute error |c − r| at most ${t.atol}`
      case 'relative': return `relative error |c − r| / |r| at most ${t.rtol}`
      case 'mixed': return `|c − r| at most ${t.atol} + ${t.rtol}·|r|`
      case 'ulps': return `within ${t.maxUlps} ULP${t.maxUlps === '1' ? '' : 's'} of r in ${format}`
      case 'condition': return `relative error at most ${t.k}·max(κ, ${t.kappaFloor ?? '1'})·u, u the unit roundoff of ${format}`
    }
  }

  function condition(c: RegionCondition): string {
    if (c.op.startsWith('abs')) return `|${c.param}| ${OP_WORDS[c.op].replace('|·| ', '')} ${c.value}`
    return `${c.param} ${OP_WORDS[c.op]} ${c.value}`
  }

  function zero(c: Criterion): string {
    const { below, atol } = c.zero
    const which = Number(below) === 0 ? 'A reference value of exactly zero' : `A reference value with |r| below ${below}`
    return `${which} is judged by absolute error instead: |c − r| at most ${atol}.`
  }

  function overflow(c: Criterion): string {
    return c.overflow.signedInf === 'pass'
      ? `Where the reference is beyond the largest finite ${c.format} value, an infinity of the same sign counts as a pass.`
      : `Where the reference is beyond the largest finite ${c.format} value, an infinity of the same sign still counts as a fail.`
  }

  function nan(c: Criterion): string {
    return c.nan.verdict === 'fail'
      ? 'A NaN in the output counts as a fail.'
      : 'A NaN in the output gets the verdict non-finite (neither pass nor an ordinary fail).'
  }

  function part(p: GridPart): string {
    if (p.kind === 'points') return `${p.points.length} explicit point${p.points.length === 1 ? '' : 's'}`
    if (p.kind === 'range') {
      return p.axes.map(a => 'values' in a ? `${a.param} ∈ {${a.values.join(', ')}}` : `${a.param} from ${a.start} to ${a.stop} step ${a.step}`).join(' × ')
    }
    const axes = p.axes.map(a => `${a.param} in [${a.min}, ${a.max}] at ${a.places} place${a.places === 1 ? '' : 's'}`).join(', ')
    const fixed = Object.entries(p.fixed ?? {}).map(([k, v]) => `${k} = ${v}`).join(', ')
    return `${p.count} seeded random draws (seed ${p.seed}): ${axes}${fixed ? `; ${fixed}` : ''}`
  }

  return { tolerance, condition, zero, overflow, nan, part }
}

/** Split an exact decimal string into mantissa and exponent, so exponents can be set apart. */
export function splitExponent(v: string): { mantissa: string, exponent: string | null } {
  const m = /^([^eE]*)[eE]([+-]?\d+)$/.exec(v.trim())
  if (!m) return { mantissa: v, exponent: null }
  return { mantissa: m[1] ?? v, exponent: String(Number(m[2])) }
}
