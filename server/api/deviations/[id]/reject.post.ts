import { idParamSchema } from '../../../../shared/schemas/auth'
import { decideDeviationSchema } from '../../../../shared/schemas/deviation'

// A second person rejects a proposed deviation (two-person rule).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'viewer', 'admin')
  const { id } = validParams(event, idParamSchema)
  const { comment } = await validBody(event, decideDeviationSchema)
  await decideDeviation(user, id, 'rejected', comment)
  return { deviation: await deviationView(user, id) }
})
