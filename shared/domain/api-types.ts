// Shapes of the API replies that pages read. The server builds exactly these;
// pages import them for typing. Exact numbers are strings throughout.
import type { Verdict } from './enums'
import type { CellState } from './board'
import type { DeviationState } from './deviations'

export interface ReferenceSetSummary {
  id: number
  slug: string
  revision: number
  name: string
  functionId: string
  convention: string
  targetDigits: number
  state: 'draft' | 'computing' | 'ready' | 'failed'
  caseCount: number
  casesDone: number
  frozenAt: string | null
  source: string
}

export interface ReferenceSetDetail extends ReferenceSetSummary {
  definition: unknown // the ReferenceSetDefinition as saved (shared/schemas/reference-set.ts)
  error: string | null
  revisions: { id: number, revision: number, state: string, frozenAt: string | null, createdAt: string }[]
  runCount: number
}

export interface PreviewCase {
  inputs: Record<string, string>
  region: string
  value: string
  digits: number
  kappa: string | null
}

export interface ReferenceSetPreview {
  caseCount: number
  regions: Record<string, number>
  cases: PreviewCase[]
}

export interface TablePreview {
  format: string
  encoding: string
  columns: string[]
  rows: { line: number, fields: string[] }[]
  rowCount: number
  /** Suggested mapping from the set's parameter names and `value` to column names. */
  mapping: Record<string, string>
  errors: { line: number, column: number, field?: string, message: string }[]
  errorCount: number
}

export interface RunFigures {
  total: number
  counts: Record<Verdict, number>
  maxRelError: string | null
  medianRelError: string | null
  rmsRelError: string | null
  maxUlps: string | null
}

export interface RunDetail {
  id: number
  createdAt: string
  code: { slug: string, name: string }
  version: { id: number, label: string, commitId: string }
  set: { id: number, slug: string, name: string, revision: number, functionId: string, targetDigits: number, parameters: string[], criterion: unknown }
  fileName: string
  fileSha256: string
  fileSize: number
  submittedBy: string | null
  state: CellState
  summary: RunFigures
  regions: Record<string, RunFigures>
  worst: RunCaseRow | null
  isRegression: boolean
  /** Counts as judged and stored, before any deviation accepted a failure. */
  storedCounts: Record<Verdict, number>
  /** Approved deviations that apply to this run, with how many failures each accepted. */
  deviations: AppliedDeviation[]
}

export interface AppliedDeviation {
  id: number
  scope: 'case' | 'region' | 'set'
  caseInputKey: string | null
  region: string | null
  reason: string
  expiresAtVersion: string | null
  expiresOn: string | null
  accepted: number
}

export interface RunCaseRow {
  id: number
  line: number | null
  inputs: Record<string, string> | null
  region: string | null
  measured: string | null
  reference: string | null
  referenceDigits: number | null
  kappa: string | null
  absError: string | null
  relError: string | null
  ulps: string | null
  digitsAgreed: string | null
  /** The verdict as shown: `accepted` when an approved deviation covers a failure. */
  verdict: Verdict
  decidedBy: string
  /** The verdict the run was judged with, as stored. */
  storedVerdict: Verdict
  /** The deviation that accepted this failure, if any. */
  acceptedBy: number | null
}

export interface RunCasePage {
  total: number
  page: number
  pageSize: number
  rows: RunCaseRow[]
}

export interface ErrorMapPoint {
  x: number
  y: number
  /** log10 of the ULP distance (or of the relative error when ULPs are not defined); null for non-finite; −20 stands for an error of exactly zero. */
  log10: number | null
  verdict: Verdict
  caseId: number
}

export interface ErrorMap {
  xParam: string
  yParam: string | null
  metric: 'ulps' | 'relative'
  points: ErrorMapPoint[]
}

export interface DeviationPerson { id: number, name: string, email: string }

export interface DeviationView {
  id: number
  code: { slug: string, name: string }
  setSlug: string
  scope: 'case' | 'region' | 'set'
  caseInputKey: string | null
  region: string | null
  reason: string
  /** The state as stored. */
  state: DeviationState
  /** The state as it stands now: `expired` once an approved deviation's date has passed. */
  standing: DeviationState
  proposedBy: DeviationPerson
  proposedAt: string
  decidedBy: DeviationPerson | null
  decidedAt: string | null
  decisionComment: string | null
  expiresAtVersion: string | null
  expiresOn: string | null
  history: { at: string, actor: string, action: string, comment: string | null }[]
  /** What the caller may do with it. */
  may: { decide: boolean, withdraw: boolean }
}
