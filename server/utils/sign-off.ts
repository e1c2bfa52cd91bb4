// Sign-off of a version: an owner signs once every required reference set
// has a run on it; someone else (a viewer, or an admin) countersigns. A
// signature keeps the run ids and the summary the signer saw; a later run on
// the version marks it superseded (the database refuses any other change).
import { and, desc, eq, inArray, isNull } from 'drizzle-orm'
import { cellState, type CellState } from '../../shared/domain/board'
import type { Verdict } from '../../shared/domain/enums'
import type { Code, SignOff, Version } from '../database/schema'
import type { CurrentUser } from './auth'
import { mailSettings } from '../mail/config'
import { queueSignOffNotice } from '../mail/notifications'
import type { Tx, Writer } from './audit'

type Counts = Partial<Record<Verdict, number>>

/** What a signer sees for one reference set of the version. */
export interface SignedSet {
  slug: string
  name: string
  required: boolean
  run: null | { id: number, revision: number, currentRevision: number, state: CellState, counts: Counts, storedCounts: Counts, maxRelError: string | null, maxUlps: string | null, createdAt: string }
}

export async function codeVersion(slug: string, label: string): Promise<{ code: Code, version: Version }> {
  const [row] = await useDb().select({ code: schema.codes, version: schema.versions }).from(schema.versions)
    .innerJoin(schema.codes, eq(schema.codes.id, schema.versions.codeId))
    .where(and(eq(schema.codes.slug, slug), eq(schema.versions.label, label)))
  if (!row) throw httpError(404, 'not_found', `${slug} has no version "${label}".`)
  return row
}

export async function requiredSetSlugs(codeId: number): Promise<string[]> {
  const rows = await useDb().select({ slug: schema.codeRequiredSets.setSlug }).from(schema.codeRequiredSets)
    .where(eq(schema.codeRequiredSets.codeId, codeId)).orderBy(schema.codeRequiredSets.setSlug)
  return rows.map(x => x.slug)
}

/** The latest run per reference set on this version, and every required set (with or without a run), counts with deviations applied. */
export async function versionSets(codeId: number, versionId: number): Promise<SignedSet[]> {
  const db = useDb()
  const { runs, referenceSets: sets } = schema
  const required = await requiredSetSlugs(codeId)
  const rows = await db.select({ id: runs.id, setId: runs.setId, counts: runs.counts, maxRelError: runs.maxRelError, maxUlps: runs.maxUlps, createdAt: runs.createdAt, slug: sets.slug, name: sets.name, revision: sets.revision })
    .from(runs).innerJoin(sets, eq(sets.id, runs.setId)).where(eq(runs.versionId, versionId)).orderBy(desc(runs.id))
  const latest = new Map<string, (typeof rows)[number]>()
  for (const row of rows) if (!latest.has(row.slug)) latest.set(row.slug, row)
  const slugs = [...new Set([...required, ...latest.keys()])].sort()
  const revs = slugs.length
    ? await db.select({ slug: sets.slug, name: sets.name, revision: sets.revision }).from(sets).where(inArray(sets.slug, slugs)).orderBy(desc(sets.revision))
    : []
  const current = new Map<string, { name: string, revision: number }>()
  for (const s of revs) if (!current.has(s.slug)) current.set(s.slug, s)
  const adjusted = await countsWithDeviations([...latest.values()].map(x => ({ id: x.id, versionId, setId: x.setId, setSlug: x.slug, counts: x.counts })))
  return slugs.map((slug) => {
    const run = latest.get(slug)
    const cur = current.get(slug)
    const counts = run ? adjusted.get(run.id) ?? run.counts : {}
    return {
      slug,
      name: cur?.name ?? run?.name ?? slug,
      required: required.includes(slug),
      run: run
        ? {
            id: run.id, revision: run.revision, currentRevision: cur?.revision ?? run.revision,
            state: cellState({ revision: run.revision, counts }, cur?.revision ?? run.revision),
            counts, storedCounts: run.counts, maxRelError: run.maxRelError, maxUlps: run.maxUlps, createdAt: new Date(run.createdAt).toISOString(),
          }
        : null,
    }
  })
}

/** Signatures of a version that no later run has superseded. */
async function activeSignOffs(tx: Writer, versionId: number): Promise<SignOff[]> {
  return tx.select().from(schema.signOffs).where(and(eq(schema.signOffs.versionId, versionId), isNull(schema.signOffs.supersededByRunId))).orderBy(schema.signOffs.id)
}

const lockVersion = (tx: Tx, id: number) => tx.select({ id: schema.versions.id }).from(schema.versions).where(eq(schema.versions.id, id)).for('update')

/** The owner's signature: refused (409) while a required set has no run on the version, or while a signature stands. */
export async function signVersion(user: CurrentUser, slug: string, label: string, comment: string): Promise<number> {
  const { code, version } = await codeVersion(slug, label)
  await requireCodeOwner(user, code)
  return useDb().transaction(async (tx) => {
    await lockVersion(tx, version.id)
    const sets = await versionSets(code.id, version.id)
    const missing = sets.filter(s => s.required && !s.run).map(s => s.slug)
    if (missing.length) throw httpError(409, 'required_sets_missing', `${code.slug} ${label} cannot be signed yet: no run on the required set${missing.length === 1 ? '' : 's'} ${missing.join(', ')}.`, { missing })
    if (!sets.some(s => s.run)) throw httpError(409, 'no_runs', `${code.slug} ${label} has no runs to sign.`)
    if ((await activeSignOffs(tx, version.id)).some(s => s.kind === 'sign')) throw httpError(409, 'already_signed', `${code.slug} ${label} is already signed; a new run on it would supersede that signature.`)
    const runIds = sets.flatMap(s => (s.run ? [s.run.id] : []))
    const [row] = await tx.insert(schema.signOffs).values({ versionId: version.id, userId: user.id, kind: 'sign', runIds, summary: sets, comment }).$returningId()
    await recordAudit(tx, user, 'sign-version', 'sign-off', row!.id, { code: code.slug, version: label, runIds, comment })
    await queueSignOffNotice(tx, row!.id, { link: `${mailSettings().appUrl}/records/${code.slug}/${encodeURIComponent(label)}` })
    return row!.id
  })
}

/** A second person's countersignature on the standing signature (two-person rule). */
export async function countersignVersion(user: CurrentUser, slug: string, label: string, comment: string): Promise<number> {
  const { code, version } = await codeVersion(slug, label)
  return useDb().transaction(async (tx) => {
    await lockVersion(tx, version.id)
    const active = await activeSignOffs(tx, version.id)
    const signature = active.find(s => s.kind === 'sign')
    if (!signature) throw httpError(409, 'not_signed', `${code.slug} ${label} has no standing signature to countersign; an owner signs first.`)
    if (signature.userId === user.id) throw httpError(403, 'two_person_rule', `You signed ${code.slug} ${label}, so you may not countersign it: a second person must.`)
    if (active.some(s => s.kind === 'countersign')) throw httpError(409, 'already_countersigned', `${code.slug} ${label} is already countersigned.`)
    const sets = await versionSets(code.id, version.id)
    const runIds = sets.flatMap(s => (s.run ? [s.run.id] : []))
    const [row] = await tx.insert(schema.signOffs).values({ versionId: version.id, userId: user.id, kind: 'countersign', runIds, summary: sets, comment }).$returningId()
    await recordAudit(tx, user, 'countersign-version', 'sign-off', row!.id, { code: code.slug, version: label, signOffId: signature.id, runIds, comment })
    return row!.id
  })
}

/** Inside a run's store transaction: a new run on a signed version supersedes its standing signatures. */
export async function supersedeSignOffs(tx: Writer, versionId: number, runId: number, actor: CurrentUser | { id: null, email: string }) {
  const standing = await activeSignOffs(tx, versionId)
  if (!standing.length) return
  await tx.update(schema.signOffs).set({ supersededByRunId: runId }).where(and(eq(schema.signOffs.versionId, versionId), isNull(schema.signOffs.supersededByRunId)))
  for (const s of standing) await recordAudit(tx, actor, 'supersede-sign-off', 'sign-off', s.id, { versionId, runId })
}
