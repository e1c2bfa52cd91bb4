import { desc } from 'drizzle-orm'

// The catalogue of reference sets: the newest revision of each, with how many older ones exist.
export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const r = schema.referenceSets
  const rows = await useDb()
    .select({ id: r.id, slug: r.slug, revision: r.revision, name: r.name, functionId: r.functionId, convention: r.convention, targetDigits: r.targetDigits, state: r.state, caseCount: r.caseCount, frozenAt: r.frozenAt, source: r.source })
    .from(r)
    .orderBy(r.slug, desc(r.revision))
  const latest = new Map<string, (typeof rows)[number]>()
  for (const row of rows) if (!latest.has(row.slug)) latest.set(row.slug, row)
  return { sets: [...latest.values()] }
})
