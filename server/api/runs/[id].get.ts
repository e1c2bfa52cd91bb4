import { idParamSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read', 'submit'] })
  const { id } = validParams(event, idParamSchema)
  await requireRunAccess(caller, id)
  return { run: await loadRun(id) }
})
