import { asc, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParamSchema } from '../../../../shared/schemas/auth'
import { csvCell } from '../../../utils/csv'

const query = z.object({
  format: z.enum(['csv', 'json'], { error: 'Choose csv or json.' }).default('csv'),
  digits: z.coerce.number().int().min(1).optional(),
})

// Reference values for teams to use as test data, at any digit count up to the certified one.
export default defineEventHandler(async (event) => {
  await requireRole(event, ...ANY_ROLE)
  const { id } = validParams(event, idParamSchema)
  const { format, digits } = validQuery(event, query)
  const set = await loadSet(id)
  if (set.state !== 'ready') throw httpError(409, 'not_ready', `Reference set ${set.slug} r${set.revision} is ${set.state}; its values can be downloaded once it is ready.`)
  if (digits !== undefined && digits > set.targetDigits) {
    throw httpError(400, 'invalid_input', `Invalid query: digits: at most ${set.targetDigits} (the set's certified digits).`, { issues: [{ field: 'digits', message: `At most ${set.targetDigits}.` }] })
  }
  const c = schema.cases
  const rows = await useDb().select().from(c).where(eq(c.setId, id)).orderBy(asc(c.ordinal))
  const params = parameterNames(set.functionId)
  const values = rows.map((r) => {
    const d = Math.min(digits ?? r.certifiedDigits, r.certifiedDigits)
    return { inputs: r.inputs, value: reround(r.referenceValue, r.certifiedDigits, d, () => recomputeValue(set, r.inputs, d)), digits: d, kappa: r.conditionNumber, region: r.region }
  })
  const name = `${set.slug}-r${set.revision}${digits ? `-${digits}d` : ''}`
  if (format === 'json') {
    setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.json"`)
    return {
      set: { slug: set.slug, revision: set.revision, name: set.name, functionId: set.functionId, output: set.output, convention: set.convention, targetDigits: set.targetDigits, source: set.source },
      cases: values,
    }
  }
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.csv"`)
  const lines = [[...params, set.output, 'digits', 'kappa', 'region'].join(',')]
  for (const v of values) lines.push([...params.map(p => csvCell(v.inputs[p] ?? '')), v.value, String(v.digits), v.kappa ?? '', csvCell(v.region)].join(','))
  return lines.join('\n') + '\n'
})
