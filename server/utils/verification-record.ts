// The verification record of one code version: everything a QA record asks
// for, assembled once here and used by the record page and every export
// (JSON, CSV, JUnit XML in server/utils/record-exports.ts).
import { and, asc, desc, eq, notInArray } from 'drizzle-orm'
import { standingForVersion } from '../../shared/domain/deviations'
import { sortVersions } from '../../shared/domain/versions'
import type { RunCaseRow } from '../../shared/domain/api-types'
import type { RecordReference, RecordSet, VerificationRecord } from '../../shared/domain/record-types'
import type { CurrentUser } from './auth'

export const RECORD_CAUTION = 'A verdict from Plumbline is evidence for a verification record. It does not replace an organisation\'s QA programme. '
  + 'Where results feed safety-related work, the organisation\'s procedures, local codes and licensed review govern.'

const SHOWN_OK = ['pass', 'accepted'] as const

/** Assemble the record; `failureLimit` caps the failing cases listed per set (exports read every case through recordCases). */
/** `viewer` is null for a CI token: it reads the record but may act on nothing in it. */
export async function buildRecord(viewer: CurrentUser | null, slug: string, label: string, failureLimit = 200): Promise<VerificationRecord> {
  const db = useDb()
  const { code, version } = await codeVersion(slug, label)
  const [team] = await db.select({ name: schema.teams.name }).from(schema.teams).where(eq(schema.teams.id, code.teamId))
  const summary = await versionSets(code.id, version.id)
  const sets: RecordSet[] = []
  for (const s of summary) {
    const run = s.run ? await loadRun(s.run.id) : null
    const reference = await referenceFor(s.slug, run?.set.id ?? null)
    let failures: RunCaseRow[] = []
    let failureCount = 0
    if (run) {
      const { columns } = await runDeviationColumns({ id: run.id, versionId: version.id, setId: run.set.id, setSlug: run.set.slug })
      const r = schema.caseResults
      const where = and(eq(r.runId, run.id), notInArray(columns.verdict, [...SHOWN_OK]))
      failures = await db.select(caseRowColumns(columns)).from(r).leftJoin(schema.cases, eq(schema.cases.id, r.caseId)).where(where).orderBy(asc(r.id)).limit(failureLimit)
      failureCount = Object.entries(run.summary.counts).filter(([v]) => !(SHOWN_OK as readonly string[]).includes(v)).reduce((n, [, c]) => n + c, 0)
    }
    sets.push({ slug: s.slug, required: s.required, reference, run, failures, failureCount })
  }
  const slugs = sets.map(s => s.slug)
  const versions = sortVersions(await db.select().from(schema.versions).where(eq(schema.versions.codeId, code.id)))
  const now = new Date()
  const deviations = slugs.length
    ? (await listDeviations(viewer, { codeId: code.id })).filter(d => slugs.includes(d.setSlug)).reverse().map(d => ({ ...d, forThisVersion: standingForVersion(d, version, versions, now) }))
    : []
  const signRows = await db.select({ s: schema.signOffs, name: schema.users.name, email: schema.users.email }).from(schema.signOffs)
    .innerJoin(schema.users, eq(schema.users.id, schema.signOffs.userId)).where(eq(schema.signOffs.versionId, version.id)).orderBy(asc(schema.signOffs.id))
  return {
    generatedAt: now.toISOString(),
    caution: RECORD_CAUTION,
    code: { slug: code.slug, name: code.name, team: team?.name ?? '', description: code.description, language: code.language },
    version: { id: version.id, label: version.label, commitId: version.commitId, environment: version.environment, createdAt: new Date(version.createdAt).toISOString() },
    requiredSets: summary.filter(s => s.required).map(s => s.slug),
    missingRequired: summary.filter(s => s.required && !s.run).map(s => s.slug),
    sets,
    deviations,
    signOffs: signRows.map(({ s, name, email }) => ({
      id: s.id, kind: s.kind, by: { name, email }, at: new Date(s.createdAt).toISOString(), comment: s.comment,
      runIds: s.runIds, summary: s.summary, supersededByRunId: s.supersededByRunId,
    })),
  }
}

/** The set revision the run used (else the current one), with what the record must show of it. */
async function referenceFor(slug: string, usedId: number | null): Promise<RecordReference | null> {
  const sets = schema.referenceSets
  const revs = await useDb().select().from(sets).where(eq(sets.slug, slug)).orderBy(desc(sets.revision))
  const used = revs.find(x => x.id === usedId) ?? revs[0]
  if (!used) return null
  return {
    id: used.id, revision: used.revision, currentRevision: revs[0]!.revision, name: used.name, functionId: used.functionId, convention: used.convention,
    output: used.output, source: used.source, targetDigits: used.targetDigits, criterion: used.criterion, caseCount: used.caseCount,
    frozenAt: used.frozenAt ? new Date(used.frozenAt).toISOString() : null, definition: definitionOf(used),
  }
}

/** Every case result of the record's runs, verdicts shown with deviations applied, in line order per set. */
export async function recordCases(record: VerificationRecord): Promise<Map<string, RunCaseRow[]>> {
  const out = new Map<string, RunCaseRow[]>()
  const r = schema.caseResults
  for (const s of record.sets) {
    if (!s.run) continue
    const { columns } = await runDeviationColumns({ id: s.run.id, versionId: record.version.id, setId: s.run.set.id, setSlug: s.slug })
    out.set(s.slug, await useDb().select(caseRowColumns(columns)).from(r).leftJoin(schema.cases, eq(schema.cases.id, r.caseId)).where(eq(r.runId, s.run.id)).orderBy(asc(r.id)))
  }
  return out
}
