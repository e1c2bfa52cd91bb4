import { versionParams } from '../../../../../../shared/schemas/sign-off'

// The verification record of a version, as the record page shows it.
export default defineEventHandler(async (event) => {
  // people of any role, or a read token of this code (CI shows the record too)
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const { slug, label } = validParams(event, versionParams)
  requireCodeAccess(caller, (await findCode(slug)).id)
  const user = caller.user
  return { record: await buildRecord(user, slug, label) }
})
