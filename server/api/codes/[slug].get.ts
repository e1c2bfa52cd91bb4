import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { sortVersions } from '../../../shared/domain/versions'

const params = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,64}$/, { error: 'A code slug is lower-case letters, digits and dashes.' }) })

export default defineEventHandler(async (event) => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const { slug } = validParams(event, params)
  const db = useDb()
  const { codes, teams, versions } = schema
  const [code] = await db
    .select({ id: codes.id, slug: codes.slug, name: codes.name, description: codes.description, language: codes.language, team: teams.name })
    .from(codes)
    .innerJoin(teams, eq(teams.id, codes.teamId))
    .where(eq(codes.slug, slug))
  if (!code) throw httpError(404, 'not_found', `There is no code "${slug}".`)
  requireCodeAccess(caller, code.id)
  const list = await db.select().from(versions).where(eq(versions.codeId, code.id))
  const owners = await db
    .select({ id: schema.users.id, name: schema.users.name, email: schema.users.email })
    .from(schema.codeOwners)
    .innerJoin(schema.users, eq(schema.users.id, schema.codeOwners.userId))
    .where(eq(schema.codeOwners.codeId, code.id))
  return { code, owners, versions: sortVersions(list) }
})
