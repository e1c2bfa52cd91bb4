import { signOffSchema, versionParams } from '../../../../../../shared/schemas/sign-off'

// An owner of the code signs the version, over the runs and summary they see now.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'owner', 'admin')
  const { slug, label } = validParams(event, versionParams)
  const { comment } = await validBody(event, signOffSchema)
  const id = await signVersion(user, slug, label, comment)
  setResponseStatus(event, 201)
  return { signOff: { id } }
})
