import { idParamSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const { id } = validParams(event, idParamSchema)
  return { run: await loadRun(id) }
})
