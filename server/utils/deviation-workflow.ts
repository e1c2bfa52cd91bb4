// Proposing and settling deviations. An owner of the code (or an admin)
// proposes; someone else (qa, viewer or admin) approves or rejects; the
// proposer may withdraw. Every change is one transaction with its audit
// entry, and nothing is ever deleted.
import { and, desc, eq, inArray } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { expiredByDate, standing, type DeviationState } from '../../shared/domain/deviations'
import type { ProposeDeviationInput } from '../../shared/schemas/deviation'
import { inputKey } from '../../shared/grid/keys'
import { DEFAULT_REGION } from '../../shared/compare/regions'
import type { DeviationView } from '../../shared/domain/api-types'
import type { Deviation } from '../database/schema'
import type { CurrentUser } from './auth'
import { mailSettings } from '../mail/config'
import { queueDeviationApprovalRequest } from '../mail/notifications'

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null)

export async function codeBySlug(slug: string) {
  const [code] = await useDb().select({ id: schema.codes.id, slug: schema.codes.slug, name: schema.codes.name }).from(schema.codes).where(eq(schema.codes.slug, slug))
  if (!code) throw httpError(404, 'not_found', `There is no code "${slug}".`)
  return code
}

/** The codes a user may act on as owner: every code for an admin, the ones they own for an owner. */
export async function ownedCodeIds(user: CurrentUser): Promise<Set<number> | 'all'> {
  if (user.role === 'admin') return 'all'
  if (user.role !== 'owner') return new Set()
  const rows = await useDb().select({ id: schema.codeOwners.codeId }).from(schema.codeOwners).where(eq(schema.codeOwners.userId, user.id))
  return new Set(rows.map(x => x.id))
}

export async function requireCodeOwner(user: CurrentUser, code: { id: number, slug: string }) {
  const owned = await ownedCodeIds(user)
  if (owned !== 'all' && !owned.has(code.id)) throw httpError(403, 'not_code_owner', `You are not an owner of ${code.slug}; only its owners (or an administrator) may do this.`)
}

const issue = (field: string, message: string) => httpError(400, 'invalid_input', `Invalid body: ${field}: ${message}`, { issues: [{ field, message }] })

/** Check what the deviation names against the set's revisions, and store it with its audit entry. */
export async function proposeDeviation(user: CurrentUser, input: ProposeDeviationInput): Promise<number> {
  const db = useDb()
  const code = await codeBySlug(input.code)
  await requireCodeOwner(user, code)
  const revisions = await db.select({ id: schema.referenceSets.id, functionId: schema.referenceSets.functionId, criterion: schema.referenceSets.criterion })
    .from(schema.referenceSets).where(eq(schema.referenceSets.slug, input.set)).orderBy(desc(schema.referenceSets.revision))
  if (!revisions.length) throw issue('set', `There is no reference set "${input.set}".`)
  let caseInputKey: string | null = null
  let region: string | null = null
  if (input.scope === 'case') {
    try {
      caseInputKey = inputKey(input.inputs!, revisions[0]!.functionId)
    }
    catch (e) {
      throw issue('inputs', e instanceof Error ? e.message : 'The inputs are not valid.')
    }
    const [hit] = await db.select({ id: schema.cases.id }).from(schema.cases)
      .where(and(inArray(schema.cases.setId, revisions.map(x => x.id)), eq(schema.cases.inputKey, caseInputKey))).limit(1)
    if (!hit) throw issue('inputs', `No case of ${input.set} has the inputs ${caseInputKey}.`)
  }
  if (input.scope === 'region') {
    const names = new Set([DEFAULT_REGION, ...revisions.flatMap(x => ((x.criterion as { regions?: { name: string }[] }).regions ?? []).map(g => g.name))])
    if (!names.has(input.region!)) throw issue('region', `${input.set} has no region "${input.region}"; its regions are ${[...names].join(', ')}.`)
    region = input.region!
  }
  const expiresOn = input.expiresOn ? new Date(`${input.expiresOn}T00:00:00Z`) : null
  if (expiresOn && expiresOn.getTime() <= Date.now()) throw issue('expiresOn', 'The expiry date must be in the future.')
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(schema.deviations).values({
      codeId: code.id, setSlug: input.set, scope: input.scope, caseInputKey, region, reason: input.reason,
      proposedBy: user.id, expiresAtVersion: input.expiresAtVersion ?? null, expiresOn,
    }).$returningId()
    await recordAudit(tx, user, 'propose-deviation', 'deviation', row!.id, { code: code.slug, set: input.set, scope: input.scope, caseInputKey, region, reason: input.reason, expiresAtVersion: input.expiresAtVersion ?? null, expiresOn: iso(expiresOn) })
    // the request to approve goes to those who may settle it, stored with the proposal
    await queueDeviationApprovalRequest(tx, row!.id, { link: `${mailSettings().appUrl}/deviations?code=${code.slug}` })
    return row!.id
  })
}

async function loadDeviation(id: number): Promise<Deviation> {
  const [row] = await useDb().select().from(schema.deviations).where(eq(schema.deviations.id, id))
  if (!row) throw httpError(404, 'not_found', `There is no deviation with id ${id}.`)
  return row
}

/** Approve or reject a proposed deviation; the proposer may not (two-person rule). */
export async function decideDeviation(user: CurrentUser, id: number, decision: 'approved' | 'rejected', comment: string) {
  const d = await loadDeviation(id)
  if (d.proposedBy === user.id) {
    throw httpError(403, 'two_person_rule', `You proposed deviation ${id}, so you may not ${decision === 'approved' ? 'approve' : 'reject'} it: a second person (qa, viewer or admin) must settle it.`)
  }
  if (d.state !== 'proposed') throw httpError(409, 'not_proposed', `Deviation ${id} is ${d.state}; only a proposed deviation can be approved or rejected.`)
  if (decision === 'approved' && expiredByDate(d, new Date())) throw httpError(409, 'expired', `Deviation ${id} expired on ${iso(d.expiresOn)!.slice(0, 10)} before it was approved; propose it again with a new expiry.`)
  await useDb().transaction(async (tx) => {
    const [res] = await tx.update(schema.deviations).set({ state: decision, decidedBy: user.id, decidedAt: new Date(), decisionComment: comment })
      .where(and(eq(schema.deviations.id, id), eq(schema.deviations.state, 'proposed')))
    if (res.affectedRows !== 1) throw httpError(409, 'not_proposed', `Deviation ${id} was settled by someone else a moment ago.`)
    await recordAudit(tx, user, decision === 'approved' ? 'approve-deviation' : 'reject-deviation', 'deviation', id, { comment })
  })
}

/** The proposer takes a proposed or approved deviation back; it stays on record as withdrawn. */
export async function withdrawDeviation(user: CurrentUser, id: number, comment: string) {
  const d = await loadDeviation(id)
  if (d.proposedBy !== user.id) throw httpError(403, 'not_proposer', `Only the person who proposed deviation ${id} may withdraw it.`)
  if (d.state !== 'proposed' && d.state !== 'approved') throw httpError(409, 'not_withdrawable', `Deviation ${id} is ${d.state}; only a proposed or approved deviation can be withdrawn.`)
  await useDb().transaction(async (tx) => {
    const [res] = await tx.update(schema.deviations).set({ state: 'withdrawn' })
      .where(and(eq(schema.deviations.id, id), inArray(schema.deviations.state, ['proposed', 'approved'])))
    if (res.affectedRows !== 1) throw httpError(409, 'not_withdrawable', `Deviation ${id} changed a moment ago; read it again.`)
    await recordAudit(tx, user, 'withdraw-deviation', 'deviation', id, { from: d.state, comment })
  })
}

/** Deviations with their people and history, newest first; `may` is worked out for `viewer`. */
export async function listDeviations(viewer: CurrentUser | null, filter: { codeId?: number, setSlug?: string, state?: DeviationState, ids?: number[] }): Promise<DeviationView[]> {
  const db = useDb()
  const { deviations: d, codes, users } = schema
  const decider = alias(users, 'decider')
  const where = []
  if (filter.codeId) where.push(eq(d.codeId, filter.codeId))
  if (filter.setSlug) where.push(eq(d.setSlug, filter.setSlug))
  if (filter.ids) where.push(inArray(d.id, filter.ids.length ? filter.ids : [0]))
  // `expired` is read from the dates, not stored: filter it after reading
  if (filter.state && filter.state !== 'expired') where.push(eq(d.state, filter.state))
  if (filter.state === 'expired') where.push(eq(d.state, 'approved'))
  const rows = await db.select({ d, code: { slug: codes.slug, name: codes.name }, by: { id: users.id, name: users.name, email: users.email }, decider: { id: decider.id, name: decider.name, email: decider.email } })
    .from(d).innerJoin(codes, eq(codes.id, d.codeId)).innerJoin(users, eq(users.id, d.proposedBy)).leftJoin(decider, eq(decider.id, d.decidedBy))
    .where(where.length ? and(...where) : undefined).orderBy(desc(d.id))
  const ids = rows.map(x => x.d.id)
  const audit = ids.length
    ? await db.select().from(schema.auditLog).where(and(eq(schema.auditLog.objectType, 'deviation'), inArray(schema.auditLog.objectId, ids.map(String)))).orderBy(schema.auditLog.id)
    : []
  const now = new Date()
  const views = rows.map(({ d: row, code, by, decider: dec }): DeviationView => {
    const st = standing(row, now)
    return {
      id: row.id, code, setSlug: row.setSlug, scope: row.scope, caseInputKey: row.caseInputKey, region: row.region, reason: row.reason,
      state: row.state, standing: st, proposedBy: by, proposedAt: iso(row.proposedAt)!,
      decidedBy: dec?.id ? dec as DeviationView['decidedBy'] : null, decidedAt: iso(row.decidedAt), decisionComment: row.decisionComment,
      expiresAtVersion: row.expiresAtVersion, expiresOn: iso(row.expiresOn),
      history: audit.filter(a => a.objectId === String(row.id)).map(a => ({ at: iso(a.at)!, actor: a.actor, action: a.action, comment: ((a.detail as { comment?: string }).comment ?? null) || null })),
      may: {
        decide: viewer !== null && row.state === 'proposed' && st === 'proposed' && row.proposedBy !== viewer.id && ['qa', 'viewer', 'admin'].includes(viewer.role),
        withdraw: viewer !== null && (row.state === 'proposed' || row.state === 'approved') && row.proposedBy === viewer.id,
      },
    }
  })
  return filter.state === 'expired' ? views.filter(v => v.standing === 'expired') : views
}

export async function deviationView(viewer: CurrentUser, id: number): Promise<DeviationView> {
  const [v] = await listDeviations(viewer, { ids: [id] })
  if (!v) throw httpError(404, 'not_found', `There is no deviation with id ${id}.`)
  return v
}
