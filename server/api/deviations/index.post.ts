import { proposeDeviationSchema } from '../../../shared/schemas/deviation'

// An owner of the code proposes a deviation for a case, a region or a whole set.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'owner', 'admin')
  const input = await validBody(event, proposeDeviationSchema)
  const id = await proposeDeviation(user, input)
  const deviation = await deviationView(user, id)
  setResponseStatus(event, 201)
  return { deviation }
})
