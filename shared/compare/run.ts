/**
 * Judging a whole run: match the parsed rows to the set's cases, judge each
 * matched case, give missing, duplicate and unexpected rows their own
 * verdicts, and summarise. Order of the results: every case in case order
 * (judged or missing), then duplicate rows, then unexpected rows, each in
 * file order. A duplicate keeps its measured text but is never judged (the
 * first row for a case is; see match.ts).
 */
import type { Verdict } from '../domain/enums'
import type { Criterion } from '../schemas/criterion'
import { compileCriterion } from './criterion'
import { judgeSetCase, type MeasuredValue, type ReferenceValue } from './judge'
import { matchByKey } from './match'
import { inputKey } from '../grid/keys'
import { RunSummarizer, type RunSummary } from './summary'

export interface RunCase { key: string; inputs: Record<string, string>; reference: ReferenceValue; region?: string }
export interface RunRow { inputs: Record<string, string>; measured: MeasuredValue }

/**
 * A table's rows as judging reads them, one row at a time, so that a large
 * table need not be copied into row objects: `key(i)` is the canonical key
 * of row i's inputs (throws when they can't be read), `measured(i)` its value.
 */
export interface RunRows {
  readonly length: number
  key(rowIndex: number): string
  measured(rowIndex: number): MeasuredValue
}

/** RunRows over an array of row objects. */
export function rowsOf(rows: readonly RunRow[], functionId: string): RunRows {
  return { length: rows.length, key: i => inputKey(rows[i]!.inputs, functionId), measured: i => rows[i]!.measured }
}

export interface RunResult {
  caseIndex: number | null
  rowIndex: number | null
  key: string | null
  region?: string
  /** The measured value exactly as written; null for a missing case. */
  measured: string | null
  verdict: Verdict
  decidedBy: string
  absError: string | null
  relError: string | null
  ulps: string | null
  digitsAgreed: number | null
}

function blank(verdict: Verdict, decidedBy: string, caseIndex: number | null, rowIndex: number | null, key: string | null, measured: string | null, region?: string): RunResult {
  return { caseIndex, rowIndex, key, region, measured, verdict, decidedBy, absError: null, relError: null, ulps: null, digitsAgreed: null }
}

/** Judge every case of a run and summarise it; see the file header for the order and the rules. */
export function judgeRun(functionId: string, cases: readonly RunCase[], rows: readonly RunRow[] | RunRows, criterion: Criterion): { results: RunResult[]; summary: RunSummary } {
  const results: RunResult[] = []
  const steps = judgeRunInChunks(functionId, cases, rows, criterion)
  for (let step = steps.next(); ; step = steps.next()) {
    if (step.done) return { results, summary: step.value.summary }
    for (const r of step.value) results.push(r)
  }
}

/**
 * The same judging, handed out in chunks of about `chunkSize` results as they
 * are made, so a caller can store one chunk while the next is judged. The
 * chunks, in order, are the run's results; the generator keeps none of them
 * (the summary is gathered as they are made) and returns the summary and the
 * worst result.
 */
export function* judgeRunInChunks(functionId: string, cases: readonly RunCase[], rowList: readonly RunRow[] | RunRows, criterion: Criterion, chunkSize = 5000): Generator<RunResult[], { summary: RunSummary; worst: RunResult | null }> {
  const cc = compileCriterion(criterion)
  const rows = Array.isArray(rowList) ? rowsOf(rowList, functionId) : rowList as RunRows
  const m = matchByKey(cases, rows.length, i => rows.key(i))
  const summarizer = new RunSummarizer()
  let worst: RunResult | null = null
  let chunk: RunResult[] = []
  const push = (r: RunResult) => {
    if (summarizer.add(r)) worst = r
    chunk.push(r)
  }
  // every case in case order: judged when it has a row, else missing
  for (let caseIndex = 0; caseIndex < cases.length; caseIndex++) {
    const cs = cases[caseIndex]!
    const rowIndex = m.rowOfCase[caseIndex]!
    if (rowIndex < 0) push(blank('missing', 'no-row', caseIndex, null, cs.key, null, cs.region))
    else {
      const measured = rows.measured(rowIndex)
      const j = judgeSetCase(cs, measured, cc)
      push({ caseIndex, rowIndex, key: cs.key, region: j.region, measured: measured.raw, verdict: j.verdict, decidedBy: j.decidedBy, absError: j.absError, relError: j.relError, ulps: j.ulps, digitsAgreed: j.digitsAgreed })
    }
    if (chunk.length >= chunkSize) { yield chunk; chunk = [] }
  }
  for (const d of m.duplicate) {
    const cs = cases[d.caseIndex]!
    push(blank('duplicate', `duplicate-of-row:${d.firstRowIndex}`, d.caseIndex, d.rowIndex, cs.key, rows.measured(d.rowIndex).raw, cs.region))
  }
  for (const u of m.unexpected) push(blank('unexpected', u.key === null ? 'unreadable-inputs' : 'no-case', null, u.rowIndex, u.key, rows.measured(u.rowIndex).raw))
  if (chunk.length > 0) yield chunk
  return { summary: summarizer.finish(), worst }
}
