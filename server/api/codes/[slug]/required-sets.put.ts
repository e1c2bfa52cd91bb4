import { and, eq, inArray } from 'drizzle-orm'
import { codeParams, requiredSetsSchema } from '../../../../shared/schemas/sign-off'

// A verification engineer chooses the reference sets a code's versions must run before sign-off (the list is replaced whole).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'admin')
  const { slug } = validParams(event, codeParams)
  const { sets } = await validBody(event, requiredSetsSchema)
  const code = await codeBySlug(slug)
  const db = useDb()
  const known = sets.length ? await db.selectDistinct({ slug: schema.referenceSets.slug }).from(schema.referenceSets).where(inArray(schema.referenceSets.slug, sets)) : []
  const unknown = sets.map((s, i) => ({ s, i })).filter(({ s }) => !known.some(k => k.slug === s))
  if (unknown.length) {
    const issues = unknown.map(({ s, i }) => ({ field: `sets.${i}`, message: `There is no reference set "${s}".` }))
    throw httpError(400, 'invalid_input', `Invalid body: ${issues.map(x => `${x.field}: ${x.message}`).join('; ')}`, { issues })
  }
  const before = await requiredSetSlugs(code.id)
  await db.transaction(async (tx) => {
    const t = schema.codeRequiredSets
    const dropped = before.filter(s => !sets.includes(s))
    if (dropped.length) await tx.delete(t).where(and(eq(t.codeId, code.id), inArray(t.setSlug, dropped)))
    const added = sets.filter(s => !before.includes(s))
    if (added.length) await tx.insert(t).values(added.map(setSlug => ({ codeId: code.id, setSlug })))
    await recordAudit(tx, user, 'set-required-sets', 'code', code.id, { code: code.slug, before, after: [...sets].sort() })
  })
  return { code: code.slug, sets: await requiredSetSlugs(code.id) }
})
