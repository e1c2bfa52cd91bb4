import { asc, eq } from 'drizzle-orm'
import { idParamSchema } from '../../../shared/schemas/auth'
import type { ReferenceSetDetail } from '../../../shared/domain/api-types'

export default defineEventHandler(async (event): Promise<{ set: ReferenceSetDetail }> => {
  await requireRole(event, ...ANY_ROLE)
  const { id } = validParams(event, idParamSchema)
  const set = await loadSet(id)
  const r = schema.referenceSets
  const revisions = await useDb().select({ id: r.id, revision: r.revision, state: r.state, frozenAt: r.frozenAt, createdAt: r.createdAt })
    .from(r).where(eq(r.slug, set.slug)).orderBy(asc(r.revision))
  return {
    set: {
      ...summaryOf(set),
      definition: definitionOf(set),
      error: set.error,
      revisions: revisions.map(v => ({ ...v, frozenAt: v.frozenAt ? new Date(v.frozenAt).toISOString() : null, createdAt: new Date(v.createdAt).toISOString() })),
      runCount: await runCount(set.id),
    },
  }
})
