// Shapes of the API replies that pages read. The server builds exactly these;
// pages import them for typing. Exact numbers are strings throughout.
import type { Verdict } from './enums'
import type { Figures } from '../compare/summary'
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

/** A run's figures as the run summary computes them (shared/compare/summary.ts), without the worst case. */
export type RunFigures = Omit<Figures, 'worst'>

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
  /** Binned maps only: how many cases the cell holds, how many of them fail, and the inputs of the worst one (which the cell shows). */
  cases?: number
  failing?: number
  caseX?: number
  caseY?: number
}

export interface ErrorMap {
  xParam: string
  yParam: string | null
  metric: 'ulps' | 'relative'
  points: ErrorMapPoint[]
  /** Set when the run had too many cases to draw one by one: each point is then a cell of a regular grid, showing its worst case. */
  binned?: { cases: number, columns: number, rows: number }
}

export interface BoardCell {
  set: string
  state: CellState
  /** The latest run that decided the cell; null when the version has none on this set. */
  runId: number | null
  failures: number
  /** The latest run is worse than the previous version's (shared/domain/regression.ts). */
  regression: boolean
}

export interface BoardCode {
  id: number
  slug: string
  name: string
  team: string
  /** All versions of the code; `versions` may hold only the newest few. */
  versionCount: number
  versions: { id: number, label: string, commitId: string, cells: BoardCell[] }[]
}

export interface BoardReply {
  sets: { slug: string, name: string, revision: number }[]
  owners: { id: number, name: string }[]
  codes: BoardCode[]
  /** Codes matching the filters, on every page. */
  codeTotal: number
  page: number
  pageSize: number
  /** Cells by state over every matching code (and only the newest versions when `recent` is given). */
  totals: Record<CellState, number>
}

export interface CodeTrendPoint {
  versionId: number
  label: string
  runId: number
  /** The revision of the set the run was judged against. */
  revision: number
  state: CellState
  failures: number
  regression: boolean
  maxRelError: string | null
  medianRelError: string | null
  maxUlps: string | null
}

/** One reference-set slug across a code's versions (versions without a run on it are left out). */
export interface CodeTrendSeries {
  slug: string
  name: string
  revision: number
  points: CodeTrendPoint[]
}

export interface CurrentFailure {
  resultId: number
  inputs: Record<string, string> | null
  verdict: Verdict
  relError: string | null
  ulps: string | null
  /** The earliest version of the unbroken run of versions in which this case fails. */
  firstVersion: string
  firstRunId: number
}

export interface CurrentFailures {
  version: string
  versionId: number
  sets: { slug: string, name: string, runId: number, total: number, cases: CurrentFailure[] }[]
}

export interface CodeVersion {
  id: number
  label: string
  commitId: string
  environment: { compiler?: string, flags?: string, platform?: string, floatFormat?: string, libraries?: Record<string, string> }
  createdAt: string
}

export interface CodeDetail {
  code: { id: number, slug: string, name: string, description: string, language: string, team: string }
  owners: { id: number, name: string, email: string }[]
  versions: CodeVersion[]
  trend: CodeTrendSeries[]
  failures: CurrentFailures | null
}

export interface CompareRow {
  /** The case's ordinal in the newer run's set. */
  ordinal: number
  inputs: Record<string, string> | null
  fromVerdict: Verdict | null
  toVerdict: Verdict
  fromRelError: string | null
  toRelError: string | null
  /** toRelError − fromRelError, approximately (from the sort keys); positive is worse. */
  change: number | null
  /** toRelError / fromRelError, approximately; null when either is missing or zero. */
  ratio: number | null
  kind: 'newly-failing' | 'fixed' | 'still-failing' | 'worse' | 'better' | 'same' | 'new-case'
}

export interface CompareSummary {
  compared: number
  newlyFailing: number
  fixed: number
  stillFailing: number
  worse: number
  better: number
  /** Cases of the newer run's set that the older run's set does not have. */
  onlyInTo: number
  /** Cases of the older run's set that the newer run's set does not have. */
  onlyInFrom: number
  fromMaxRelError: string | null
  toMaxRelError: string | null
  line: string
}

export interface CompareReply {
  code: { slug: string, name: string }
  set: { slug: string, name: string }
  from: { label: string, runId: number, revision: number }
  to: { label: string, runId: number, revision: number }
  rule: string
  summary: CompareSummary
  total: number
  page: number
  pageSize: number
  rows: CompareRow[]
}

export interface AuditEntryRow {
  id: number
  at: string
  /** The e-mail address (or CI token prefix) that acted, as recorded. */
  actor: string
  userName: string | null
  action: string
  objectType: string
  objectId: string
  detail: unknown
}

export interface AuditPage {
  total: number
  page: number
  pageSize: number
  objectTypes: string[]
  rows: AuditEntryRow[]
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
