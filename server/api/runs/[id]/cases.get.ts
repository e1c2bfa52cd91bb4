import { count, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParamSchema } from '../../../../shared/schemas/auth'
import { VERDICTS } from '../../../../shared/domain/enums'
import type { RunCasePage } from '../../../../shared/domain/api-types'

const query = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.enum(['line', 'relError', 'absError', 'ulps', 'digitsAgreed', 'verdict']).default('line'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  verdict: z.string().optional().transform(v => (v ? v.split(',').filter(Boolean) : undefined)).pipe(z.array(z.enum(VERDICTS, { error: `Verdicts are ${VERDICTS.join(', ')}.` })).optional()),
  region: z.string().max(60).optional(),
  minRel: z.coerce.number().nonnegative().optional(),
  maxRel: z.coerce.number().nonnegative().optional(),
  /** One case result by its id (the error map's caseId). */
  caseId: z.coerce.number().int().positive().optional(),
})

// One page of a run's case results, sorted and filtered in the database.
export default defineEventHandler(async (event): Promise<RunCasePage> => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read', 'submit'] })
  const { id } = validParams(event, idParamSchema)
  await requireRunAccess(caller, id)
  const q = validQuery(event, query)
  const db = useDb()
  const run = await deviationRunRef(id)
  const { columns } = await runDeviationColumns(run)
  const where = caseWhere(id, q, columns)
  const r = schema.caseResults
  const [total] = await db.select({ n: count() }).from(r).where(where)
  const rows = await db.select(caseRowColumns(columns)).from(r).leftJoin(schema.cases, eq(schema.cases.id, r.caseId))
    .where(where).orderBy(...orderFor(q.sort, q.dir, columns)).limit(q.pageSize).offset((q.page - 1) * q.pageSize)
  return { total: total?.n ?? 0, page: q.page, pageSize: q.pageSize, rows }
})
