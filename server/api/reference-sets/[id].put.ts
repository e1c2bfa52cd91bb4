import { idParamSchema } from '../../../shared/schemas/auth'

// Editing never changes a set under a verdict: it stores a new revision (the
// newest of its slug); runs keep pointing at the revision they were judged against.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'admin')
  const { id } = validParams(event, idParamSchema)
  const { def, cases } = parseDefinition(await readJsonBody(event))
  const base = await loadSet(id)
  if (def.slug !== base.slug) {
    throw httpError(400, 'invalid_input', 'Invalid reference set: slug: a revision keeps the slug of its set.', { issues: [{ field: 'slug', message: `Keep the slug "${base.slug}"; create a new set for a new slug.` }] })
  }
  const latest = (await latestRevision(base.slug))!
  const set = await createRevision(user, def, cases.length, latest.revision + 1, latest.id)
  return { set }
})
