import { asc, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParamSchema } from '../../../../shared/schemas/auth'
import { csvCell } from '../../../utils/csv'

const query = z.object({ format: z.enum(['csv', 'json'], { error: 'Choose csv or json.' }).default('csv') })

// The whole run: every case with its measured value as written, the reference, the error figures and the verdict.
export default defineEventHandler(async (event) => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read', 'submit'] })
  const { id } = validParams(event, idParamSchema)
  await requireRunAccess(caller, id)
  const { format } = validQuery(event, query)
  const run = await loadRun(id)
  const { columns } = await runDeviationColumns({ id, versionId: run.version.id, setId: run.set.id, setSlug: run.set.slug })
  const r = schema.caseResults
  const rows = await useDb().select(caseRowColumns(columns)).from(r).leftJoin(schema.cases, eq(schema.cases.id, r.caseId)).where(eq(r.runId, id)).orderBy(asc(r.id))
  const name = `run-${id}-${run.code.slug}-${run.version.label}`
  const caution = 'A verdict is evidence for a verification record; it does not replace your organisation\'s QA programme, local codes or licensed review.'
  if (format === 'json') {
    setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.json"`)
    return { run, caution, cases: rows }
  }
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.csv"`)
  const params = run.set.parameters
  const head = ['line', ...params, 'region', 'measured', 'reference', 'reference_digits', 'abs_error', 'rel_error', 'ulps', 'digits_agreed', 'verdict', 'decided_by', 'stored_verdict', 'accepted_by_deviation']
  const lines = [`# ${caution}`, head.join(',')]
  for (const c of rows) {
    lines.push([c.line, ...params.map(p => c.inputs?.[p]), c.region, c.measured, c.reference, c.referenceDigits, c.absError, c.relError, c.ulps, c.digitsAgreed, c.verdict, c.decidedBy, c.storedVerdict, c.acceptedBy].map(v => csvCell(v as string | number | null)).join(','))
  }
  return lines.join('\n') + '\n'
})
