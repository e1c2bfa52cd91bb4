import { asc, count, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParamSchema } from '../../../../shared/schemas/auth'

const query = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
})

export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const { id } = validParams(event, idParamSchema)
  const { page, pageSize } = validQuery(event, query)
  await loadSet(id)
  const c = schema.cases
  const db = useDb()
  const [total] = await db.select({ n: count() }).from(c).where(eq(c.setId, id))
  const rows = await db.select({ ordinal: c.ordinal, inputs: c.inputs, region: c.region, value: c.referenceValue, digits: c.certifiedDigits, kappa: c.conditionNumber })
    .from(c).where(eq(c.setId, id)).orderBy(asc(c.ordinal)).limit(pageSize).offset((page - 1) * pageSize)
  return { total: total?.n ?? 0, page, pageSize, rows }
})
