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
  key?: string | null
}

export interface WorstCase { index: number; key?: string | null; verdict: Verdict; relError: string | null; absError: string | null; ulps: string | null; region?: string }

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

/** A short e-notation error string as out[0]·10^out[1] (out[1] = 0 within double range); false when absent. */
function split(s: string | null | undefined, out: Float64Array): boolean {
  if (s === null || s === undefined || s === '') return false
  const v = Math.abs(Number(s))
  if (v === 0 || (v > 1e-290 && v < 1e290)) {
    out[0] = v
    out[1] = 0
    return true
  }
  const i = s.indexOf('e')
  const m = Math.abs(Number(i < 0 ? s : s.slice(0, i)))
  const e = i < 0 ? 0 : Number(s.slice(i + 1))
  if (!Number.isFinite(m) || !Number.isFinite(e)) return false
  out[0] = m
  out[1] = e
  return true
}

/** log10 of m·10^e, the sort key of an error. */
const keyOf = (m: number, e: number) => (m === 0 ? -Infinity : Math.log10(m) + e)

/** m·10^e to 4 significant digits, e-notation like the judge's strings. */
function fmt(m: number, e: number): string {
  if (m === 0) return '0'
  const [mant, ex] = m.toExponential(3).split('e') as [string, string]
  const exp = Number(ex) + e
  return `${mant}e${exp < 0 ? '' : '+'}${exp}`
}

/** A value known by its log10 key, back as mantissa and exponent (exact for 4-digit strings after rounding to 4 digits). */
function fromKey(k: number): [number, number] {
  if (k === -Infinity) return [0, 0]
  const e = Math.floor(k)
  return [10 ** (k - e), e]
}

const JUDGED = new Set<Verdict>(['pass', 'fail', 'accepted'])
const RANK: Partial<Record<Verdict, number>> = { non_finite: 2, fail: 1, accepted: 1, pass: 0 }

/** Figures of one group of results (the run, or one region), gathered one result at a time. */
class FigureAccumulator {
  private counts = { pass: 0, fail: 0, missing: 0, unexpected: 0, non_finite: 0, duplicate: 0, accepted: 0 } as Record<Verdict, number>
  private total = 0
  private relM = new Float64Array(1024)
  private relE = new Float64Array(1024)
  private relK = new Float64Array(1024)
  private nRel = 0
  private maxUk = -Infinity
  private maxU: string | null = null
  private worst: WorstCase | null = null
  private wRank = -1
  private wRk = -Infinity
  private wAk = -Infinity

  constructor() {
    for (const v of VERDICTS) this.counts[v] = 0
  }

  add(r: RunCaseResult, index: number, tmp: Float64Array): void {
    this.total++
    this.counts[r.verdict]++
    const judged = JUDGED.has(r.verdict)
    let rk = -Infinity
    if (split(r.relError, tmp)) {
      rk = keyOf(tmp[0]!, tmp[1]!)
      if (judged) {
        if (this.nRel === this.relM.length) this.grow()
        this.relM[this.nRel] = tmp[0]!
        this.relE[this.nRel] = tmp[1]!
        this.relK[this.nRel] = rk
        this.nRel++
      }
    }
    if (judged && split(r.ulps, tmp)) {
      const k = keyOf(tmp[0]!, tmp[1]!)
      if (this.maxU === null || k > this.maxUk) { this.maxUk = k; this.maxU = fmt(tmp[0]!, tmp[1]!) }
    }
    const rank = RANK[r.verdict]
    if (rank === undefined) return
    const ak = split(r.absError, tmp) ? keyOf(tmp[0]!, tmp[1]!) : -Infinity
    if (rank > this.wRank || (rank === this.wRank && (rk > this.wRk || (rk === this.wRk && ak > this.wAk)))) {
      this.worst = { index, key: r.key, verdict: r.verdict, relError: r.relError, absError: r.absError ?? null, ulps: r.ulps, region: r.region }
      this.wRank = rank
      this.wRk = rk
      this.wAk = ak
    }
  }

  get worstIndex(): number {
    return this.worst ? this.worst.index : -1
  }

  private grow(): void {
    const n = this.relM.length * 2
    const m = new Float64Array(n); m.set(this.relM); this.relM = m
    const e = new Float64Array(n); e.set(this.relE); this.relE = e
    const k = new Float64Array(n); k.set(this.relK); this.relK = k
  }

  finish(): Figures {
    const { nRel, relM, relE, relK } = this
    let maxRel: string | null = null
    let median: string | null = null
    let rms: string | null = null
    if (nRel > 0) {
      let top = 0
      for (let j = 1; j < nRel; j++) if (relK[j]! > relK[top]!) top = j
      maxRel = fmt(relM[top]!, relE[top]!)
      const keys = relK.slice(0, nRel).sort()
      const [am, ae] = fromKey(keys[(nRel - 1) >> 1]!)
      const [bm, be] = fromKey(keys[nRel >> 1]!)
      const E = Math.max(ae, be)
      median = fmt(Number(((am * 10 ** (ae - E) + bm * 10 ** (be - E)) / 2).toPrecision(12)), E)
      // RMS = M·sqrt(Σ (x/M)² / n) with M = 10^(top exponent), so nothing overflows.
      const T = relE[top]!
      const TM = relM[top]!
      let s = 0
      if (TM > 0) for (let j = 0; j < nRel; j++) { const y = (relM[j]! / TM) * 10 ** (relE[j]! - T); s += y * y }
      rms = fmt(TM * Math.sqrt(s / nRel), T)
    }
    return { total: this.total, counts: { ...this.counts }, maxRelError: maxRel, medianRelError: median, rmsRelError: rms, maxUlps: this.maxU, worst: this.worst }
  }
}

/**
 * A run's summary gathered as its results are made, in order, so that the
 * results themselves need not be kept: the same figures as summarizeRun.
 */
export class RunSummarizer {
  private all = new FigureAccumulator()
  private regions = new Map<string, FigureAccumulator>()
  private tmp = new Float64Array(2)
  private count = 0

  /** Add the next result (its index in the run is the number added before it); true when it is now the run's worst. */
  add(r: RunCaseResult): boolean {
    const index = this.count++
    this.all.add(r, index, this.tmp)
    if (r.region !== undefined) {
      let g = this.regions.get(r.region)
      if (!g) this.regions.set(r.region, (g = new FigureAccumulator()))
      g.add(r, index, this.tmp)
    }
    return this.all.worstIndex === index
  }

  finish(): RunSummary {
    const regions: Record<string, Figures> = {}
    for (const [name, g] of this.regions) regions[name] = g.finish()
    return { ...this.all.finish(), regions }
  }
}

/** Summarise a run's results (one entry per case or extra row). */
export function summarizeRun(results: readonly RunCaseResult[]): RunSummary {
  const s = new RunSummarizer()
  for (const r of results) s.add(r)
  return s.finish()
}
