/**
 * Run summaries: counts by verdict; max, median and RMS relative error;
 * max ULPs; the worst case; and the same figures per region.
 *
 * Statistics use the cases that were judged as numbers and have a relative
 * error (pass, fail, accepted; not zero references, whose relative error is
 * undefined). They are computed from the stored 4-digit error strings, in
 * binary64 after scaling by the largest value (so 1e-400 or 1e+400 neither
 * underflow nor overflow), and reported to 4 significant digits. The median
 * of an even count is the mean of the two middle values.
 *
 * Worst case (our rule): non_finite ranks above fail and accepted, which
 * rank above pass; within a rank, the larger relative error, then the
 * larger absolute error.
 */
import { VERDICTS, type Verdict } from '../domain/enums'

export interface RunCaseResult {
  verdict: Verdict
  absError?: string | null
  relError: string | null
  ulps: string | null
  /** Unexpected rows have no region; they count only in the run's totals. */
  region?: string
  key?: string
}

export interface WorstCase { index: number; key?: string; verdict: Verdict; relError: string | null; absError: string | null; ulps: string | null; region?: string }

export interface Figures {
  total: number
  counts: Record<Verdict, number>
  maxRelError: string | null
  medianRelError: string | null
  rmsRelError: string | null
  maxUlps: string | null
  worst: WorstCase | null
}

export interface RunSummary extends Figures { regions: Record<string, Figures> }

/** A 4-digit error string as mantissa and decimal exponent (null when absent). */
function split(s: string | null | undefined): { m: number; e: number } | null {
  if (s === null || s === undefined || s === '') return null
  const i = s.search(/[eE]/)
  const m = Math.abs(Number(i < 0 ? s : s.slice(0, i)))
  const e = i < 0 ? 0 : Number(s.slice(i + 1))
  if (!Number.isFinite(m) || !Number.isFinite(e)) return null
  return { m, e }
}

const keyOf = (x: { m: number; e: number }) => (x.m === 0 ? -Infinity : Math.log10(x.m) + x.e)

function fmt(m: number, e: number): string {
  if (m === 0) return '0'
  const [mant, ex] = m.toExponential(3).split('e') as [string, string]
  const exp = Number(ex) + e
  return `${mant}e${exp < 0 ? '' : '+'}${exp}`
}

const JUDGED = new Set<Verdict>(['pass', 'fail', 'accepted'])
const RANK: Partial<Record<Verdict, number>> = { non_finite: 2, fail: 1, accepted: 1, pass: 0 }

/** The figures for one list of results (indices refer to the run's list). */
function figures(results: readonly RunCaseResult[], indices: readonly number[]): Figures {
  const counts = Object.fromEntries(VERDICTS.map(v => [v, 0])) as Record<Verdict, number>
  const rel: Array<{ m: number; e: number; k: number }> = []
  let maxU: { m: number; e: number; k: number } | null = null
  let worst: { i: number; rank: number; rk: number; ak: number } | null = null
  for (const i of indices) {
    const r = results[i]!
    counts[r.verdict]++
    const re = split(r.relError)
    if (JUDGED.has(r.verdict) && re) rel.push({ ...re, k: keyOf(re) })
    const u = split(r.ulps)
    if (JUDGED.has(r.verdict) && u) {
      const k = keyOf(u)
      if (!maxU || k > maxU.k) maxU = { ...u, k }
    }
    const rank = RANK[r.verdict]
    if (rank !== undefined) {
      const ae = split(r.absError)
      const cand = { i, rank, rk: re ? keyOf(re) : -Infinity, ak: ae ? keyOf(ae) : -Infinity }
      if (!worst || cand.rank > worst.rank || (cand.rank === worst.rank && (cand.rk > worst.rk || (cand.rk === worst.rk && cand.ak > worst.ak)))) worst = cand
    }
  }
  let maxRel: string | null = null
  let median: string | null = null
  let rms: string | null = null
  if (rel.length > 0) {
    rel.sort((a, b) => a.k - b.k)
    const top = rel[rel.length - 1]!
    maxRel = fmt(top.m, top.e)
    const n = rel.length
    const a = rel[(n - 1) >> 1]!
    const b = rel[n >> 1]!
    const E = Math.max(a.e, b.e)
    median = fmt((a.m * 10 ** (a.e - E) + b.m * 10 ** (b.e - E)) / 2, E)
    // RMS = M·sqrt(Σ (x/M)² / n) with M = 10^top.e, so nothing overflows.
    let s = 0
    for (const x of rel) { const y = x.m * 10 ** (x.e - top.e); s += y * y }
    rms = fmt(Math.sqrt(s / n), top.e)
  }
  const w = worst ? results[worst.i]! : null
  return {
    total: indices.length,
    counts,
    maxRelError: maxRel,
    medianRelError: median,
    rmsRelError: rms,
    maxUlps: maxU ? fmt(maxU.m, maxU.e) : null,
    worst: w && worst
      ? { index: worst.i, key: w.key, verdict: w.verdict, relError: w.relError, absError: w.absError ?? null, ulps: w.ulps, region: w.region }
      : null,
  }
}

/** Summarise a run's results (one entry per case or extra row). */
export function summarizeRun(results: readonly RunCaseResult[]): RunSummary {
  const all = results.map((_, i) => i)
  const byRegion = new Map<string, number[]>()
  results.forEach((r, i) => {
    if (r.region === undefined) return
    const g = byRegion.get(r.region)
    if (g) g.push(i)
    else byRegion.set(r.region, [i])
  })
  const regions: Record<string, Figures> = {}
  for (const [name, idx] of byRegion) regions[name] = figures(results, idx)
  return { ...figures(results, all), regions }
}
