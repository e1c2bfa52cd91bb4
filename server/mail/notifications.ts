// What Plumbline tells people by mail. Each function composes its message(s)
// from the database and puts them in the outbox through the writer it is given,
// so a caller inside a transaction queues the mail with its own change, or not
// at all. Nothing here sends: the worker does (scripts/worker.ts).
import { and, desc, eq, inArray, sql } from 'drizzle-orm'
import { failures } from '../../shared/domain/board'
import { ROLE_LABELS, type Role } from '../../shared/domain/enums'
import * as s from '../database/schema'
import { mailSettings } from './config'
import { queueMail, type Writer } from './outbox'
import { compose } from './templates'
import { createUserLink, setPasswordUrl } from './user-links'

const when = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`

/** Invitation for a user an administrator has just added: a link to choose a password. */
export async function queueInvitation(db: Writer, user: { id: number, email: string, name: string, role: Role }, invitedBy: { name: string }) {
  const { secret, expiresAt } = await createUserLink(db, user.id, 'invite')
  const url = setPasswordUrl(mailSettings().appUrl, secret)
  return queueMail(db, compose('invitation', user.email, 'Your Plumbline account: choose a password', {
    greeting: `Hello ${user.name},`,
    paragraphs: [
      `${invitedBy.name} has made you an account on Plumbline, the registry where numerical codes are verified against certified reference values. Your role is ${user.role}: ${ROLE_LABELS[user.role]}.`,
      `Choose your password with the link below. It works once, until ${when(expiresAt)}; after that an administrator can send a new one.`,
    ],
    action: { label: 'Choose your password', url },
    after: ['If you did not expect this message, you can ignore it: the account cannot be used until a password is chosen.'],
  }))
}

/** Reset link, for a person who asked for one on the sign-in page. */
export async function queuePasswordReset(db: Writer, user: { id: number, email: string, name: string }) {
  const { secret, expiresAt } = await createUserLink(db, user.id, 'reset')
  const url = setPasswordUrl(mailSettings().appUrl, secret)
  return queueMail(db, compose('password-reset', user.email, 'Choose a new Plumbline password', {
    greeting: `Hello ${user.name},`,
    paragraphs: [
      'Someone asked to reset the password of your Plumbline account. If it was you, choose a new password with the link below.',
      `The link works once, until ${when(expiresAt)}. Your present password keeps working until you choose a new one.`,
    ],
    action: { label: 'Choose a new password', url },
    after: ['If you did not ask for this, ignore this message; nothing changes.'],
  }))
}

async function activeUsers(db: Writer, where: ReturnType<typeof and>) {
  return db.select({ id: s.users.id, email: s.users.email, name: s.users.name }).from(s.users).where(and(eq(s.users.disabled, false), where))
}

const ownersOf = (db: Writer, codeId: number) =>
  activeUsers(db, inArray(s.users.id, db.select({ id: s.codeOwners.userId }).from(s.codeOwners).where(eq(s.codeOwners.codeId, codeId))))

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`

/**
 * Failure notice to the code's owners when a run has failing cases or is
 * flagged as a regression: the counts, the worst cases and a link to the run.
 * Returns the number of messages queued (0 for a clean run or a code without owners).
 */
export async function queueRunFailureNotice(db: Writer, runId: number): Promise<number> {
  const [row] = await db.select({ run: s.runs, version: s.versions, code: s.codes, set: s.referenceSets })
    .from(s.runs)
    .innerJoin(s.versions, eq(s.versions.id, s.runs.versionId))
    .innerJoin(s.codes, eq(s.codes.id, s.versions.codeId))
    .innerJoin(s.referenceSets, eq(s.referenceSets.id, s.runs.setId))
    .where(eq(s.runs.id, runId))
  if (!row) throw new Error(`queueRunFailureNotice: there is no run ${runId}`)
  const failing = failures(row.run.counts)
  if (failing === 0 && !row.run.isRegression) return 0
  const owners = await ownersOf(db, row.code.id)
  if (!owners.length) return 0

  const r = s.caseResults
  const worst = await db.select({ line: r.lineNumber, inputs: sql<string | null>`COALESCE(${r.inputs}, ${s.cases.inputs})`, verdict: r.verdict, relError: r.relError, ulps: r.ulps })
    .from(r).leftJoin(s.cases, eq(s.cases.id, r.caseId))
    .where(and(eq(r.runId, runId), inArray(r.verdict, ['fail', 'missing', 'unexpected', 'non_finite', 'duplicate'])))
    .orderBy(sql`${r.relErrorKey} IS NULL`, desc(r.relErrorKey), r.id)
    .limit(5)
  const inputsText = (v: unknown) => {
    const o = (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, string> | null
    return o ? Object.entries(o).map(([k, x]) => `${k}=${x}`).join(' ') : '—'
  }
  const total = Object.values(row.run.counts).reduce((a, b) => a + (b ?? 0), 0)
  const what = `${row.code.name} ${row.version.label}`
  const setName = `${row.set.slug} r${row.set.revision}`
  const subject = failing
    ? `${what}: ${plural(failing, 'case')} of ${total} fail against ${setName}${row.run.isRegression ? ' (regression)' : ''}`
    : `${what}: regression against ${setName}`
  const counts = Object.entries(row.run.counts).filter(([, n]) => n).map(([v, n]) => `${n} ${v.replace('_', '-')}`).join(', ')
  const url = `${mailSettings().appUrl}/runs/${runId}`
  let queued = 0
  for (const owner of owners) {
    await queueMail(db, compose('run-failure', owner.email, subject, {
      greeting: `Hello ${owner.name},`,
      paragraphs: [
        `Run ${runId} judged ${what} against the reference set ${row.set.name} (${setName}): ${counts}.`,
        ...(row.run.isRegression ? ['It is marked as a regression: cases that passed in an earlier version fail now.'] : []),
        `The largest relative error is ${row.run.maxRelError ?? '—'}${row.run.maxUlps ? `, ${row.run.maxUlps} ULPs` : ''}.`,
      ],
      table: worst.length ? [['case', 'verdict', 'relative error', 'ULPs'], ...worst.map(w => [w.line === null ? inputsText(w.inputs) : `${inputsText(w.inputs)} (line ${w.line})`, w.verdict, w.relError ?? '—', w.ulps ?? '—'])] : undefined,
      action: { label: 'Open the run', url },
      after: worst.length < failing ? [`The run page lists all ${plural(failing, 'failing case')}.`] : [],
      caution: true,
    }))
    queued++
  }
  return queued
}

export interface NoticeLinks {
  /** Where the message points; defaults to the code's page. */
  link?: string
}

/**
 * Request to approve a proposed deviation, to those who may settle it: the
 * code's owners and the verification engineers, never the proposer (two-person
 * rule). Returns the number of messages queued.
 */
export async function queueDeviationApprovalRequest(db: Writer, deviationId: number, links: NoticeLinks = {}): Promise<number> {
  const [row] = await db.select({ d: s.deviations, code: s.codes, by: s.users })
    .from(s.deviations)
    .innerJoin(s.codes, eq(s.codes.id, s.deviations.codeId))
    .innerJoin(s.users, eq(s.users.id, s.deviations.proposedBy))
    .where(eq(s.deviations.id, deviationId))
  if (!row) throw new Error(`queueDeviationApprovalRequest: there is no deviation ${deviationId}`)
  const { d } = row
  const owners = await ownersOf(db, row.code.id)
  const qa = await activeUsers(db, eq(s.users.role, 'qa'))
  const recipients = [...new Map([...owners, ...qa].filter(u => u.id !== d.proposedBy).map(u => [u.id, u])).values()]
  const where = d.scope === 'case' ? `the case ${d.caseInputKey ?? '?'}` : d.scope === 'region' ? `the region ${d.region ?? '?'}` : 'the whole set'
  const expiry = [d.expiresAtVersion ? `at version ${d.expiresAtVersion}` : '', d.expiresOn ? `on ${new Date(d.expiresOn).toISOString().slice(0, 10)}` : ''].filter(Boolean).join(' or ')
  const url = links.link ?? `${mailSettings().appUrl}/codes/${row.code.slug}`
  for (const u of recipients) {
    await queueMail(db, compose('deviation-approval', u.email, `Approval asked: deviation ${deviationId} on ${row.code.name}, set ${d.setSlug}`, {
      greeting: `Hello ${u.name},`,
      paragraphs: [
        `${row.by.name} proposes deviation ${deviationId} on ${row.code.name}: known failures on ${where} of the reference set ${d.setSlug} would be accepted instead of failing.`,
        `Reason given: ${d.reason}`,
        expiry ? `It would expire ${expiry}.` : 'No expiry is proposed.',
        'Approve or reject it in Plumbline. The person who proposed it cannot approve it.',
      ],
      action: { label: 'Review the deviation', url },
      caution: true,
    }))
  }
  return recipients.length
}

/**
 * Notice that a version was signed (or countersigned): to the code's owners
 * and the readers who may countersign, never the signer. Returns the number of
 * messages queued.
 */
export async function queueSignOffNotice(db: Writer, signOffId: number, links: NoticeLinks = {}): Promise<number> {
  const [row] = await db.select({ so: s.signOffs, version: s.versions, code: s.codes, by: s.users })
    .from(s.signOffs)
    .innerJoin(s.versions, eq(s.versions.id, s.signOffs.versionId))
    .innerJoin(s.codes, eq(s.codes.id, s.versions.codeId))
    .innerJoin(s.users, eq(s.users.id, s.signOffs.userId))
    .where(eq(s.signOffs.id, signOffId))
  if (!row) throw new Error(`queueSignOffNotice: there is no sign-off ${signOffId}`)
  const owners = await ownersOf(db, row.code.id)
  const viewers = await activeUsers(db, eq(s.users.role, 'viewer'))
  const recipients = [...new Map([...owners, ...viewers].filter(u => u.id !== row.so.userId).map(u => [u.id, u])).values()]
  const what = `${row.code.name} ${row.version.label}`
  const verb = row.so.kind === 'countersign' ? 'countersigned' : 'signed'
  const url = links.link ?? `${mailSettings().appUrl}/codes/${row.code.slug}`
  for (const u of recipients) {
    await queueMail(db, compose('sign-off', u.email, `${what} ${verb} by ${row.by.name}`, {
      greeting: `Hello ${u.name},`,
      paragraphs: [
        `${row.by.name} ${verb} ${what} on ${when(new Date(row.so.createdAt))}, having seen ${plural(row.so.runIds.length, 'run')}.`,
        row.so.comment ? `Their comment: ${row.so.comment}` : 'They left no comment.',
        ...(row.so.kind === 'sign' ? ['A reader (manager or auditor) may now countersign the release.'] : []),
      ],
      action: { label: 'Open the verification record', url },
      caution: true,
    }))
  }
  return recipients.length
}
