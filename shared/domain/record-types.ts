// The verification record of a version as the server sends it (assembled in
// server/utils/verification-record.ts, shown by the record page).
import type { DeviationView, RunCaseRow, RunDetail } from './api-types'
import type { VersionStanding } from './deviations'
import type { ReferenceSetDefinition } from '../schemas/reference-set'

export interface BuildEnvironmentView {
  compiler?: string
  flags?: string
  platform?: string
  floatFormat?: string
  libraries?: Record<string, string>
}

export interface RecordReference {
  id: number
  revision: number
  currentRevision: number
  name: string
  functionId: string
  convention: string
  output: string
  source: string
  targetDigits: number
  criterion: unknown
  caseCount: number
  frozenAt: string | null
  /** The set revision's definition as fixed before the run: grid, digits, criterion, source. */
  definition: ReferenceSetDefinition
}

export interface RecordSet {
  slug: string
  required: boolean
  reference: RecordReference | null
  run: RunDetail | null
  /** Failing cases (shown verdict not pass or accepted), up to the page's limit; `failureCount` has them all. */
  failures: RunCaseRow[]
  failureCount: number
}

export interface RecordSignOff {
  id: number
  kind: 'sign' | 'countersign'
  by: { name: string, email: string }
  at: string
  comment: string
  runIds: number[]
  summary: unknown
  supersededByRunId: number | null
}

export interface VerificationRecord {
  generatedAt: string
  caution: string
  code: { slug: string, name: string, team: string, description: string, language: string }
  version: { id: number, label: string, commitId: string, environment: BuildEnvironmentView, createdAt: string }
  requiredSets: string[]
  missingRequired: string[]
  sets: RecordSet[]
  deviations: Array<DeviationView & { forThisVersion: VersionStanding }>
  signOffs: RecordSignOff[]
}
