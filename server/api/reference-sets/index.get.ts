import { desc } from 'drizzle-orm'

// The catalogue of reference sets: the newest revision of each, with how many older ones exist.
export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const r = schema.referenceSets
  const rows = await useDb().select().from(r).orderBy(r.slug, desc(r.revision))
  const latest = new Map<string, (typeof rows)[number]>()
  for (const row of rows) if (!latest.has(row.slug)) latest.set(row.slug, row)
  return { sets: [...latest.values()].map(summaryOf) }
})
