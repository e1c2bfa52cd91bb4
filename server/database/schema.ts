// The whole product's schema (see the design brief): later work adds columns
// and tables, it does not reshape these. Exact numbers (inputs, reference
// values, measured values, errors) are kept as text so no digit is lost;
// nothing numeric from a solver is ever stored as a float.
import { sql } from 'drizzle-orm'
import {
  bigint,
  boolean,
  char,
  customType,
  datetime,
  double,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core'
import { ROLES, VERDICTS } from '../../shared/domain/enums'

const longBlob = customType<{ data: Buffer, driverData: Buffer }>({
  dataType: () => 'longblob',
})

const now3 = sql`CURRENT_TIMESTAMP(3)`
const createdAt = () => timestamp('created_at', { fsp: 3 }).notNull().default(now3)
const updatedAt = () =>
  timestamp('updated_at', { fsp: 3 }).notNull().default(now3).$onUpdate(() => new Date())
const id = () => int('id').autoincrement().primaryKey()
const ref = (name: string) => int(name)

export const users = mysqlTable('users', {
  id: id(),
  email: varchar('email', { length: 254 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  role: mysqlEnum('role', ROLES).notNull(),
  passwordHash: varchar('password_hash', { length: 255 }),
  disabled: boolean('disabled').notNull().default(false),
  passwordChangedAt: timestamp('password_changed_at', { fsp: 3 }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('users_email_uq').on(t.email)])

export const teams = mysqlTable('teams', {
  id: id(),
  slug: varchar('slug', { length: 64 }).notNull(),
  name: varchar('name', { length: 160 }).notNull(),
  createdAt: createdAt(),
}, t => [uniqueIndex('teams_slug_uq').on(t.slug)])

export const codes = mysqlTable('codes', {
  id: id(),
  slug: varchar('slug', { length: 64 }).notNull(),
  name: varchar('name', { length: 160 }).notNull(),
  teamId: ref('team_id').notNull().references(() => teams.id),
  description: text('description').notNull(),
  language: varchar('language', { length: 60 }).notNull().default(''),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('codes_slug_uq').on(t.slug)])

export const codeOwners = mysqlTable('code_owners', {
  codeId: ref('code_id').notNull().references(() => codes.id),
  userId: ref('user_id').notNull().references(() => users.id),
  createdAt: createdAt(),
}, t => [primaryKey({ columns: [t.codeId, t.userId] })])

/** Build environment of a version, as sent with a submission. */
export interface BuildEnvironment {
  compiler?: string
  flags?: string
  platform?: string
  floatFormat?: 'binary32' | 'binary64' | 'binary128' | string
  libraries?: Record<string, string>
}

export const versions = mysqlTable('versions', {
  id: id(),
  codeId: ref('code_id').notNull().references(() => codes.id),
  label: varchar('label', { length: 100 }).notNull(),
  commitId: varchar('commit_id', { length: 64 }).notNull().default(''),
  environment: json('environment').$type<BuildEnvironment>().notNull(),
  releasedAt: datetime('released_at', { fsp: 3 }),
  createdAt: createdAt(),
}, t => [uniqueIndex('versions_code_label_uq').on(t.codeId, t.label)])

export const referenceSetStates = ['draft', 'computing', 'ready', 'failed'] as const

export const referenceSets = mysqlTable('reference_sets', {
  id: id(),
  /** Stable key shared by every revision of the set. */
  slug: varchar('slug', { length: 80 }).notNull(),
  revision: int('revision').notNull().default(1),
  name: varchar('name', { length: 160 }).notNull(),
  functionId: varchar('function_id', { length: 40 }).notNull(),
  convention: varchar('convention', { length: 60 }).notNull(),
  /** The case grid as defined: lists, ranges, seeded random boxes; inputs as exact strings. */
  grid: json('grid').$type<unknown>().notNull(),
  targetDigits: int('target_digits').notNull(),
  /** The acceptance criterion, fixed before any run, with its zero/overflow/NaN rules and regions. */
  criterion: json('criterion').$type<unknown>().notNull(),
  source: text('source').notNull(),
  notes: text('notes').notNull().default(''),
  /** Which output of the function the set checks (e.g. 'value', 'node', 'y_even'). */
  output: varchar('output', { length: 40 }).notNull().default('value'),
  state: mysqlEnum('state', referenceSetStates).notNull().default('draft'),
  /** Why computing the set failed, in words a person can act on. */
  error: text('error'),
  caseCount: int('case_count').notNull().default(0),
  casesDone: int('cases_done').notNull().default(0),
  frozenAt: timestamp('frozen_at', { fsp: 3 }),
  supersedesId: ref('supersedes_id'),
  createdBy: ref('created_by').references(() => users.id),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [uniqueIndex('reference_sets_slug_rev_uq').on(t.slug, t.revision)])

export const cases = mysqlTable('cases', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  setId: ref('set_id').notNull().references(() => referenceSets.id),
  ordinal: int('ordinal').notNull(),
  /** Exact input strings by parameter name, e.g. {"n":"12","x":"0.5"}. */
  inputs: json('inputs').$type<Record<string, string>>().notNull(),
  /** Canonical form of the inputs used to match a solver's rows. */
  inputKey: varchar('input_key', { length: 255 }).notNull(),
  referenceValue: text('reference_value').notNull(),
  certifiedDigits: int('certified_digits').notNull(),
  conditionNumber: varchar('condition_number', { length: 64 }),
  region: varchar('region', { length: 60 }).notNull().default('all'),
  certification: varchar('certification', { length: 120 }).notNull(),
}, t => [
  uniqueIndex('cases_set_key_uq').on(t.setId, t.inputKey),
  index('cases_set_ordinal_ix').on(t.setId, t.ordinal),
])

export const codeRequiredSets = mysqlTable('code_required_sets', {
  codeId: ref('code_id').notNull().references(() => codes.id),
  setSlug: varchar('set_slug', { length: 80 }).notNull(),
  createdAt: createdAt(),
}, t => [primaryKey({ columns: [t.codeId, t.setSlug] })])

export const apiTokenScopes = ['submit', 'read'] as const

export const apiTokens = mysqlTable('api_tokens', {
  id: id(),
  codeId: ref('code_id').notNull().references(() => codes.id),
  name: varchar('name', { length: 120 }).notNull(),
  scope: mysqlEnum('scope', apiTokenScopes).notNull(),
  /** SHA-256 of the token; the token itself is shown once and never stored. */
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  prefix: varchar('prefix', { length: 16 }).notNull(),
  demoOnly: boolean('demo_only').notNull().default(false),
  expiresAt: timestamp('expires_at', { fsp: 3 }),
  revokedAt: timestamp('revoked_at', { fsp: 3 }),
  lastUsedAt: timestamp('last_used_at', { fsp: 3 }),
  createdBy: ref('created_by').references(() => users.id),
  createdAt: createdAt(),
}, t => [uniqueIndex('api_tokens_hash_uq').on(t.tokenHash)])

export const runs = mysqlTable('runs', {
  id: id(),
  versionId: ref('version_id').notNull().references(() => versions.id),
  setId: ref('set_id').notNull().references(() => referenceSets.id),
  submittedBy: ref('submitted_by').references(() => users.id),
  tokenId: ref('token_id').references(() => apiTokens.id),
  fileName: varchar('file_name', { length: 255 }).notNull(),
  fileSha256: char('file_sha256', { length: 64 }).notNull(),
  fileSize: int('file_size').notNull(),
  columnMapping: json('column_mapping').$type<Record<string, string>>().notNull(),
  /** Counts by verdict, e.g. {"pass":98,"fail":2}. */
  counts: json('counts').$type<Partial<Record<(typeof VERDICTS)[number], number>>>().notNull(),
  maxRelError: varchar('max_rel_error', { length: 64 }),
  medianRelError: varchar('median_rel_error', { length: 64 }),
  rmsRelError: varchar('rms_rel_error', { length: 64 }),
  maxUlps: varchar('max_ulps', { length: 64 }),
  worstCaseId: bigint('worst_case_id', { mode: 'number' }),
  /** The same figures per region of the parameter plane. */
  regions: json('regions').$type<unknown>().notNull(),
  isRegression: boolean('is_regression').notNull().default(false),
  createdAt: createdAt(),
}, t => [
  uniqueIndex('runs_version_set_sha_uq').on(t.versionId, t.setId, t.fileSha256),
  index('runs_set_ix').on(t.setId),
])

export const runFiles = mysqlTable('run_files', {
  runId: ref('run_id').primaryKey().references(() => runs.id),
  content: longBlob('content').notNull(),
})

export const caseResults = mysqlTable('case_results', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  runId: ref('run_id').notNull().references(() => runs.id),
  /** Null for rows the set does not contain (verdict `unexpected`). */
  caseId: bigint('case_id', { mode: 'number' }),
  lineNumber: int('line_number'),
  inputs: json('inputs').$type<Record<string, string>>(),
  measured: text('measured'),
  absError: varchar('abs_error', { length: 64 }),
  relError: varchar('rel_error', { length: 64 }),
  ulps: varchar('ulps', { length: 64 }),
  digitsAgreed: varchar('digits_agreed', { length: 16 }),
  region: varchar('region', { length: 60 }),
  /** Approximate copies of the error figures, only to sort and filter by; the exact strings above are the record. */
  relErrorKey: double('rel_error_key'),
  absErrorKey: double('abs_error_key'),
  ulpsKey: double('ulps_key'),
  verdict: mysqlEnum('verdict', VERDICTS).notNull(),
  /** Which part of the criterion decided the verdict, e.g. "rtol", "zero-rule". */
  decidedBy: varchar('decided_by', { length: 60 }).notNull(),
  acceptedByDeviationId: ref('accepted_by_deviation_id'),
}, t => [
  // Two secondary indexes only: every one costs the bulk load of a run
  // (100,000 rows) measurable time. Pages of one run filter on run_id first
  // and then read that run's rows; their sorts put NULLs last
  // (`key IS NULL, key`), which no index serves, so per-run indexes on
  // region or error keys would be paid for at every load and not used.
  index('case_results_run_verdict_ix').on(t.runId, t.verdict),
  index('case_results_case_ix').on(t.caseId),
])

export const deviationScopes = ['case', 'region', 'set'] as const
export const deviationStates = ['proposed', 'approved', 'rejected', 'withdrawn', 'expired'] as const

export const deviations = mysqlTable('deviations', {
  id: id(),
  codeId: ref('code_id').notNull().references(() => codes.id),
  setSlug: varchar('set_slug', { length: 80 }).notNull(),
  scope: mysqlEnum('scope', deviationScopes).notNull(),
  caseInputKey: varchar('case_input_key', { length: 255 }),
  region: varchar('region', { length: 60 }),
  reason: text('reason').notNull(),
  state: mysqlEnum('state', deviationStates).notNull().default('proposed'),
  proposedBy: ref('proposed_by').notNull().references(() => users.id),
  proposedAt: timestamp('proposed_at', { fsp: 3 }).notNull().default(now3),
  decidedBy: ref('decided_by').references(() => users.id),
  decidedAt: timestamp('decided_at', { fsp: 3 }),
  decisionComment: text('decision_comment'),
  expiresAtVersion: varchar('expires_at_version', { length: 100 }),
  expiresOn: datetime('expires_on', { fsp: 3 }),
}, t => [index('deviations_code_set_ix').on(t.codeId, t.setSlug)])

export const signOffKinds = ['sign', 'countersign'] as const

export const signOffs = mysqlTable('sign_offs', {
  id: id(),
  versionId: ref('version_id').notNull().references(() => versions.id),
  userId: ref('user_id').notNull().references(() => users.id),
  kind: mysqlEnum('kind', signOffKinds).notNull(),
  runIds: json('run_ids').$type<number[]>().notNull(),
  /** The summary the signer saw, kept as it was. */
  summary: json('summary').$type<unknown>().notNull(),
  comment: text('comment').notNull(),
  supersededByRunId: ref('superseded_by_run_id'),
  createdAt: createdAt(),
}, t => [index('sign_offs_version_ix').on(t.versionId)])

/** Append-only: triggers in the migrations refuse UPDATE and DELETE. */
export const auditLog = mysqlTable('audit_log', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  at: timestamp('at', { fsp: 3 }).notNull().default(now3),
  userId: ref('user_id'),
  actor: varchar('actor', { length: 254 }).notNull(),
  action: varchar('action', { length: 60 }).notNull(),
  objectType: varchar('object_type', { length: 40 }).notNull(),
  objectId: varchar('object_id', { length: 64 }).notNull(),
  detail: json('detail').$type<unknown>().notNull(),
}, t => [index('audit_log_object_ix').on(t.objectType, t.objectId)])

export const loginAttempts = mysqlTable('login_attempts', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  email: varchar('email', { length: 254 }).notNull(),
  address: varchar('address', { length: 64 }).notNull(),
  succeeded: boolean('succeeded').notNull(),
  at: timestamp('at', { fsp: 3 }).notNull().default(now3),
}, t => [
  index('login_attempts_email_ix').on(t.email, t.at),
  index('login_attempts_address_ix').on(t.address, t.at),
])

export const userTokenPurposes = ['invite', 'reset'] as const

export const userTokens = mysqlTable('user_tokens', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id),
  purpose: mysqlEnum('purpose', userTokenPurposes).notNull(),
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  expiresAt: timestamp('expires_at', { fsp: 3 }).notNull(),
  usedAt: timestamp('used_at', { fsp: 3 }),
  createdAt: createdAt(),
}, t => [uniqueIndex('user_tokens_hash_uq').on(t.tokenHash)])

export const mailStates = ['queued', 'sent', 'failed'] as const

export const mailOutbox = mysqlTable('mail_outbox', {
  id: id(),
  kind: varchar('kind', { length: 40 }).notNull(),
  toAddress: varchar('to_address', { length: 254 }).notNull(),
  subject: varchar('subject', { length: 255 }).notNull(),
  textBody: text('text_body').notNull(),
  htmlBody: text('html_body').notNull(),
  state: mysqlEnum('state', mailStates).notNull().default('queued'),
  attempts: int('attempts').notNull().default(0),
  lastError: text('last_error'),
  nextAttemptAt: timestamp('next_attempt_at', { fsp: 3 }).notNull().default(now3),
  sentAt: timestamp('sent_at', { fsp: 3 }),
  createdAt: createdAt(),
}, t => [index('mail_outbox_state_ix').on(t.state, t.nextAttemptAt)])

export const jobStates = ['queued', 'running', 'done', 'failed'] as const

/** Heavy work (reference computation), claimed with SELECT … FOR UPDATE SKIP LOCKED. */
export const jobs = mysqlTable('jobs', {
  id: id(),
  kind: varchar('kind', { length: 40 }).notNull(),
  payload: json('payload').$type<unknown>().notNull(),
  state: mysqlEnum('state', jobStates).notNull().default('queued'),
  progress: int('progress').notNull().default(0),
  total: int('total').notNull().default(0),
  claimedBy: varchar('claimed_by', { length: 80 }),
  claimedAt: timestamp('claimed_at', { fsp: 3 }),
  error: text('error'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('jobs_state_ix').on(t.state, t.id)])

export type User = typeof users.$inferSelect
export type NewUser = typeof users.$inferInsert
export type Team = typeof teams.$inferSelect
export type Code = typeof codes.$inferSelect
export type NewCode = typeof codes.$inferInsert
export type Version = typeof versions.$inferSelect
export type NewVersion = typeof versions.$inferInsert
export type ReferenceSet = typeof referenceSets.$inferSelect
export type NewReferenceSet = typeof referenceSets.$inferInsert
export type Case = typeof cases.$inferSelect
export type Run = typeof runs.$inferSelect
export type CaseResult = typeof caseResults.$inferSelect
export type Deviation = typeof deviations.$inferSelect
export type SignOff = typeof signOffs.$inferSelect
export type ApiToken = typeof apiTokens.$inferSelect
export type AuditEntry = typeof auditLog.$inferSelect
export type NewAuditEntry = typeof auditLog.$inferInsert
export type MailMessage = typeof mailOutbox.$inferSelect
export type Job = typeof jobs.$inferSelect
