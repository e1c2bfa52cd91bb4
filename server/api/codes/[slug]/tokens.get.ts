import { codeSlugParamSchema } from '../../../../shared/schemas/api-token'

// The code's CI tokens, live and dead, without their secrets.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'qa', 'admin')
  const { slug } = validParams(event, codeSlugParamSchema)
  const code = await findCode(slug)
  return { tokens: await listTokens({ codeId: code.id }) }
})
