import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import { z } from 'zod'
import { cellState, failures, type CellState } from '../../shared/domain/board'
import { sortVersions } from '../../shared/domain/versions'
import type { BoardCell, BoardReply } from '../../shared/domain/api-types'
import type { Counts } from '../utils/board'

const query = z.object({
  code: z.string().max(64).optional(),
  owner: z.coerce.number().int().positive().optional(),
  set: z.string().max(80).optional(),
  /** Only the newest N versions of each code (the page asks for a few; the full history is one filter away). */
  recent: z.coerce.number().int().min(1).max(1000).optional(),
  /** Codes per page (all when left out); the totals always count every code. */
  pageSize: z.coerce.number().int().min(1).max(200).optional(),
  page: z.coerce.number().int().min(1).default(1),
})

// Codes × versions × reference sets, one cell per set: the latest run decides it.
export default defineEventHandler(async (event): Promise<BoardReply> => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const filter = validQuery(event, query)
  const db = useDb()
  const { codes, teams, versions, referenceSets: sets, codeOwners, users } = schema

  const codeWhere = []
  const ownCode = tokenCodeId(caller) // a read token sees its own code only
  if (ownCode !== null) codeWhere.push(eq(codes.id, ownCode))
  if (filter.code) codeWhere.push(eq(codes.slug, filter.code))
  if (filter.owner) {
    const owned = db.select({ id: codeOwners.codeId }).from(codeOwners).where(eq(codeOwners.userId, filter.owner))
    codeWhere.push(inArray(codes.id, owned))
  }
  const codeRows = await db
    .select({ id: codes.id, slug: codes.slug, name: codes.name, team: teams.name })
    .from(codes).innerJoin(teams, eq(teams.id, codes.teamId))
    .where(codeWhere.length ? and(...codeWhere) : undefined)
    .orderBy(teams.name, codes.name)
  const owners = await db.selectDistinct({ id: users.id, name: users.name }).from(codeOwners)
    .innerJoin(users, eq(users.id, codeOwners.userId)).orderBy(asc(users.name))

  // the current (highest) revision of each slug
  const allSets = await db.select({ slug: sets.slug, name: sets.name, revision: sets.revision }).from(sets).orderBy(sets.slug, desc(sets.revision))
  const current = new Map<string, { slug: string, name: string, revision: number }>()
  for (const s of allSets) if (!current.has(s.slug)) current.set(s.slug, s)
  const setList = [...current.values()].filter(s => !filter.set || s.slug === filter.set)

  const codeIds = codeRows.map(c => c.id)
  const versionRows = codeIds.length
    ? await db.select({ id: versions.id, codeId: versions.codeId, label: versions.label, commitId: versions.commitId, createdAt: versions.createdAt })
      .from(versions).where(inArray(versions.codeId, codeIds))
    : []
  const byCode = new Map<number, typeof versionRows>()
  for (const v of versionRows) byCode.set(v.codeId, [...(byCode.get(v.codeId) ?? []), v])
  const shown = new Map<number, typeof versionRows>()
  for (const c of codeRows) {
    const all = sortVersions(byCode.get(c.id) ?? [])
    shown.set(c.id, filter.recent ? all.slice(-filter.recent) : all)
  }
  const latest = await latestRuns([...shown.values()].flat().map(v => v.id), filter.set)
  const runOf = new Map(latest.map(r => [`${r.versionId}:${r.slug}`, r]))

  // THE place where a cell's latest-run counts become its state: approved
  // deviations turn the failures they cover into `accepted` (server/utils/deviations.ts)
  const withDeviations = await countsWithDeviations(latest.map(r => ({ id: r.id, versionId: r.versionId, setId: r.setId, setSlug: r.slug, counts: r.counts })))
  const countsByRun = new Map<number, Counts>(latest.map(r => [r.id, withDeviations.get(r.id) ?? r.counts]))

  const totals: Record<CellState, number> = { passed: 0, failed: 0, accepted: 0, unverified: 0, stale: 0 }
  const cell = (versionId: number, slug: string, revision: number): BoardCell => {
    const run = runOf.get(`${versionId}:${slug}`)
    const counts = run ? countsByRun.get(run.id)! : null
    const state = cellState(run && counts ? { revision: run.revision, counts } : null, revision)
    totals[state]++
    return { set: slug, state, runId: run?.id ?? null, failures: counts ? failures(counts) : 0, regression: run?.isRegression ?? false }
  }

  const all = codeRows.map(c => ({
    ...c,
    versionCount: byCode.get(c.id)?.length ?? 0,
    versions: shown.get(c.id)!.map(v => ({
      id: v.id,
      label: v.label,
      commitId: v.commitId,
      cells: setList.map(s => cell(v.id, s.slug, s.revision)),
    })),
  }))
  const size = filter.pageSize ?? Math.max(1, all.length)
  return {
    sets: setList,
    owners,
    codes: all.slice((filter.page - 1) * size, filter.page * size),
    codeTotal: all.length,
    page: filter.page,
    pageSize: size,
    totals,
  }
})
