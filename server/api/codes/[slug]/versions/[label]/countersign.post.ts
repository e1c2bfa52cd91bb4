import { signOffSchema, versionParams } from '../../../../../../shared/schemas/sign-off'

// A viewer (or an admin) countersigns the standing signature; never the signer themselves.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'viewer', 'admin')
  const { slug, label } = validParams(event, versionParams)
  const { comment } = await validBody(event, signOffSchema)
  const id = await countersignVersion(user, slug, label, comment)
  setResponseStatus(event, 201)
  return { signOff: { id } }
})
