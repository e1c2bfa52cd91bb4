// Save a new reference set; a worker computes its cases (progress on the set row).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'admin')
  const { def, cases } = parseDefinition(await readJsonBody(event))
  if (await latestRevision(def.slug)) {
    throw httpError(409, 'conflict', `A reference set "${def.slug}" exists; edit it to make a new revision.`, { issues: [{ field: 'slug', message: 'This slug is taken; choose another or revise the existing set.' }] })
  }
  const set = await createRevision(user, def, cases.length, 1, null)
  setResponseStatus(event, 201)
  return { set }
})
