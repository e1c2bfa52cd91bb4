import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { sortVersions } from '../../../shared/domain/versions'
import type { CodeDetail } from '../../../shared/domain/api-types'

const params = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,64}$/, { error: 'A code slug is lower-case letters, digits and dashes.' }) })
/** `at`: list the failures of this version instead of the newest one with runs. */
const query = z.object({ at: z.string().trim().min(1).max(100).optional() })

// One code: its owners, its versions in release order with their builds, the
// worst and median error per reference set across versions, and where each
// current failure began.
export default defineEventHandler(async (event): Promise<CodeDetail> => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const { slug } = validParams(event, params)
  const { at } = validQuery(event, query)
  const db = useDb()
  const { codes, teams, versions } = schema
  const [code] = await db
    .select({ id: codes.id, slug: codes.slug, name: codes.name, description: codes.description, language: codes.language, team: teams.name })
    .from(codes)
    .innerJoin(teams, eq(teams.id, codes.teamId))
    .where(eq(codes.slug, slug))
  if (!code) throw httpError(404, 'not_found', `There is no code "${slug}".`)
  requireCodeAccess(caller, code.id)
  const list = sortVersions(await db.select().from(versions).where(eq(versions.codeId, code.id)))
  const owners = await db
    .select({ id: schema.users.id, name: schema.users.name, email: schema.users.email })
    .from(schema.codeOwners)
    .innerJoin(schema.users, eq(schema.users.id, schema.codeOwners.userId))
    .where(eq(schema.codeOwners.codeId, code.id))
  if (at && !list.some(v => v.label === at)) throw httpError(404, 'not_found', `${code.name} has no version "${at}".`, { issues: [{ field: 'at', message: 'No such version.' }] })
  const trend = await codeTrend(list)
  return {
    code,
    owners,
    versions: list.map(v => ({ id: v.id, label: v.label, commitId: v.commitId, environment: v.environment, createdAt: new Date(v.createdAt).toISOString() })),
    trend,
    failures: await currentFailures(list, trend, at),
  }
})
