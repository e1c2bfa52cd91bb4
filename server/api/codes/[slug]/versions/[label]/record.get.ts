import { versionParams } from '../../../../../../shared/schemas/sign-off'

// The verification record of a version, as the record page shows it.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ...ANY_ROLE)
  const { slug, label } = validParams(event, versionParams)
  return { record: await buildRecord(user, slug, label) }
})
