import { and, desc, eq, inArray } from 'drizzle-orm'
import { z } from 'zod'
import { cellState, failures, type CellState } from '../../shared/domain/board'
import { sortVersions } from '../../shared/domain/versions'

const query = z.object({
  code: z.string().max(64).optional(),
  owner: z.coerce.number().int().positive().optional(),
  set: z.string().max(80).optional(),
})

// Codes × versions × reference sets, one cell per set: the latest run decides it.
export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const filter = validQuery(event, query)
  const db = useDb()
  const { codes, teams, versions, referenceSets: sets, runs, codeOwners } = schema

  const codeWhere = []
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

  const allSets = await db.select({ id: sets.id, slug: sets.slug, name: sets.name, revision: sets.revision }).from(sets).orderBy(sets.slug, desc(sets.revision))
  const current = new Map<string, { slug: string, name: string, revision: number }>()
  for (const s of allSets) if (!current.has(s.slug)) current.set(s.slug, s)
  const setList = [...current.values()].filter(s => !filter.set || s.slug === filter.set)
  const revisionOf = new Map(allSets.map(s => [s.id, s]))

  const codeIds = codeRows.map(c => c.id)
  const versionRows = codeIds.length ? await db.select().from(versions).where(inArray(versions.codeId, codeIds)) : []
  const versionIds = versionRows.map(v => v.id)
  const runRows = versionIds.length
    ? await db.select({ id: runs.id, versionId: runs.versionId, setId: runs.setId, counts: runs.counts }).from(runs).where(inArray(runs.versionId, versionIds)).orderBy(desc(runs.id))
    : []
  const latestRun = new Map<string, (typeof runRows)[number]>()
  for (const run of runRows) {
    const set = revisionOf.get(run.setId)
    if (!set) continue
    const key = `${run.versionId}:${set.slug}`
    if (!latestRun.has(key)) latestRun.set(key, run)
  }

  // approved deviations turn the failures they cover into `accepted` (server/utils/deviations.ts)
  const withDeviations = await countsWithDeviations([...latestRun.values()].map(run => ({ ...run, setSlug: revisionOf.get(run.setId)!.slug })))

  const cell = (versionId: number, slug: string, revision: number) => {
    const run = latestRun.get(`${versionId}:${slug}`)
    const counts = run ? withDeviations.get(run.id) ?? run.counts : null
    const judged = run ? { revision: revisionOf.get(run.setId)!.revision, counts: counts! } : null
    const state: CellState = cellState(judged, revision)
    return { set: slug, state, runId: run?.id ?? null, failures: counts ? failures(counts) : 0 }
  }

  return {
    sets: setList,
    codes: codeRows.map(c => ({
      ...c,
      versions: sortVersions(versionRows.filter(v => v.codeId === c.id)).map(v => ({
        id: v.id,
        label: v.label,
        commitId: v.commitId,
        cells: setList.map(s => cell(v.id, s.slug, s.revision)),
      })),
    })),
  }
})
