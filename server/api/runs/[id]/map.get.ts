import { eq, isNotNull, and } from 'drizzle-orm'
import { idParamSchema } from '../../../../shared/schemas/auth'
import type { ErrorMap } from '../../../../shared/domain/api-types'
import { binErrorMap } from '../../../../shared/domain/error-map'

// Points for the error map: the set's first two numeric parameters as axes,
// log10 of the ULP distance (or of the relative error when no ULPs exist).
export default defineEventHandler(async (event): Promise<ErrorMap> => {
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read', 'submit'] })
  const { id } = validParams(event, idParamSchema)
  await requireRunAccess(caller, id)
  const run = await loadRun(id)
  const { columns } = await runDeviationColumns({ id, versionId: run.version.id, setId: run.set.id, setSlug: run.set.slug })
  const r = schema.caseResults
  const rows = await useDb().select({ id: r.id, inputs: schema.cases.inputs, ulps: r.ulpsKey, rel: r.relErrorKey, verdict: columns.verdict })
    .from(r).innerJoin(schema.cases, eq(schema.cases.id, r.caseId)).where(and(eq(r.runId, id), isNotNull(r.caseId)))
  const params = run.set.parameters.filter(p => rows.some(row => row.inputs && Number.isFinite(Number(row.inputs[p]))))
  const xParam = params.includes('x') ? 'x' : params.includes('z') ? 'z' : params[params.length - 1] ?? 'x'
  const yParam = params.find(p => p !== xParam) ?? null
  const metric = rows.some(row => row.ulps !== null) ? 'ulps' : 'relative'
  const log = (v: number | null) => (v === null ? null : v <= 0 ? -Infinity : Math.log10(v))
  // past MAP_CELL_LIMIT cases the map comes binned: each grid cell shows its worst case
  return binErrorMap({
    xParam,
    yParam,
    metric,
    points: rows.map(row => ({
      x: Number(row.inputs?.[xParam]),
      y: yParam ? Number(row.inputs?.[yParam]) : 0,
      log10: (() => {
        const l = log(metric === 'ulps' ? row.ulps : row.rel)
        return l === -Infinity ? -20 : l
      })(),
      verdict: row.verdict,
      caseId: row.id,
    })),
  })
})
