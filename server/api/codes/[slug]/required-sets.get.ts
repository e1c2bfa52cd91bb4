import { codeParams } from '../../../../shared/schemas/sign-off'

// The reference sets a version of this code must have runs on before it can be signed.
export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const { slug } = validParams(event, codeParams)
  const code = await codeBySlug(slug)
  return { code: code.slug, sets: await requiredSetSlugs(code.id) }
})
