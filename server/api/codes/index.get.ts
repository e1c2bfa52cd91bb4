import { asc, count, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const ownCode = tokenCodeId(caller)
  const db = useDb()
  const { codes, teams, versions } = schema
  const rows = await db
    .select({ id: codes.id, slug: codes.slug, name: codes.name, description: codes.description, language: codes.language, team: teams.name, versionCount: count(versions.id) })
    .from(codes)
    .innerJoin(teams, eq(teams.id, codes.teamId))
    .leftJoin(versions, eq(versions.codeId, codes.id))
    .where(ownCode === null ? undefined : eq(codes.id, ownCode))
    .groupBy(codes.id, teams.name)
    .orderBy(asc(teams.name), asc(codes.name))
  const owners = await db
    .select({ codeId: schema.codeOwners.codeId, name: schema.users.name })
    .from(schema.codeOwners)
    .innerJoin(schema.users, eq(schema.users.id, schema.codeOwners.userId))
  return {
    codes: rows.map(c => ({ ...c, owners: owners.filter(o => o.codeId === c.id).map(o => o.name) })),
  }
})
