import { deviationListQuery } from '../../../shared/schemas/deviation'

// Every deviation (filter by code, set, state), with who proposed and settled
// it, its history, and what the caller may do; `mayPropose` lists the codes
// the caller may propose deviations on.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ...ANY_ROLE)
  const q = validQuery(event, deviationListQuery)
  const code = q.code ? await codeBySlug(q.code) : null
  const deviations = await listDeviations(user, { codeId: code?.id, setSlug: q.set, state: q.state })
  const owned = await ownedCodeIds(user)
  const codes = await useDb().select({ id: schema.codes.id, slug: schema.codes.slug }).from(schema.codes)
  return { deviations, mayPropose: codes.filter(c => owned === 'all' || owned.has(c.id)).map(c => c.slug) }
})
