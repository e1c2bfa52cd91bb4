import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { compareQuerySchema } from '../../../../shared/schemas/compare'
import type { CompareReply } from '../../../../shared/domain/api-types'

const params = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,64}$/, { error: 'A code slug is lower-case letters, digits and dashes.' }) })

// Two versions of one code over the same reference set, case by case; one
// page of the cases, sorted and filtered in the database.
export default defineEventHandler(async (event): Promise<CompareReply> => {
  await requireRole(event, ...ANY_ROLE)
  const { slug } = validParams(event, params)
  const q = validQuery(event, compareQuerySchema)
  const [code] = await useDb().select({ id: schema.codes.id, slug: schema.codes.slug, name: schema.codes.name }).from(schema.codes).where(eq(schema.codes.slug, slug))
  if (!code) throw httpError(404, 'not_found', `There is no code "${slug}".`)
  return compareCodeVersions(code, q)
})
