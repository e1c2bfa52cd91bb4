import { idParamSchema } from '../../../../shared/schemas/auth'
import { withdrawDeviationSchema } from '../../../../shared/schemas/deviation'

// The proposer withdraws a deviation; it stays on record as withdrawn.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'owner', 'admin')
  const { id } = validParams(event, idParamSchema)
  const { comment } = await validBody(event, withdrawDeviationSchema)
  await withdrawDeviation(user, id, comment)
  return { deviation: await deviationView(user, id) }
})
