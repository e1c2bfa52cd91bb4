import { evaluateBatch } from '../../../shared/reference'
import type { ReferenceSetPreview } from '../../../shared/domain/api-types'

const PREVIEW_CASES = 8

// A look at a definition before it is saved: how many cases, per region, and the first few reference values.
export default defineEventHandler(async (event): Promise<ReferenceSetPreview> => {
  await requireRole(event, 'qa', 'admin')
  const { def, cases } = parseDefinition(await readJsonBody(event))
  const regions: Record<string, number> = {}
  for (const c of cases) regions[c.region] = (regions[c.region] ?? 0) + 1
  const head = cases.slice(0, PREVIEW_CASES)
  const results = evaluateBatch(def.functionId, head.map(c => c.inputs), def.targetDigits)
  return {
    caseCount: cases.length,
    regions,
    cases: head.map((c, i) => {
      const outs = results[i]!.outputs
      const out = (outs.find(o => o.name === (def.output ?? outs[0]?.name)) ?? outs[0])!
      return { inputs: c.inputs, region: c.region, value: out.value, digits: out.digits, kappa: out.kappa }
    }),
  }
})
