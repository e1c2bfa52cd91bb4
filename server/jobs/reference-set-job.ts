// Computing a reference set: expand its grid, evaluate every case with the
// engine at the target certified digits, and store all cases in one
// transaction together with the set's `ready` state. Progress is written to
// the set row as it goes, outside that transaction, so pages can show it.
import { eq } from 'drizzle-orm'
import type { Db } from '../database/client'
import { cases, referenceSets } from '../database/schema'
import { expandReferenceSet } from '../../shared/grid'
import { evaluateBatch } from '../../shared/reference'
import type { ReferenceSetDefinition } from '../../shared/schemas/reference-set'
import { finish } from './queue'

const CHUNK = 500
const INSERT_BATCH = 1000

export async function computeReferenceSet(db: Db, jobId: number, setId: number) {
  const [set] = await db.select().from(referenceSets).where(eq(referenceSets.id, setId))
  if (!set) throw new Error(`reference set ${setId} no longer exists`)
  const def = { functionId: set.functionId, grid: set.grid, criterion: set.criterion } as Pick<ReferenceSetDefinition, 'functionId' | 'grid' | 'criterion'>
  const grid = expandReferenceSet(def)
  await db.update(referenceSets).set({ state: 'computing', caseCount: grid.length, casesDone: 0, error: null }).where(eq(referenceSets.id, setId))

  const rows: Array<typeof cases.$inferInsert> = []
  for (let i = 0; i < grid.length; i += CHUNK) {
    const chunk = grid.slice(i, i + CHUNK)
    const results = evaluateBatch(set.functionId, chunk.map(c => c.inputs), set.targetDigits)
    results.forEach((r, j) => {
      const c = chunk[j]!
      const out = r.outputs.find(o => o.name === set.output) ?? r.outputs[0]
      if (!out) throw new Error(`the engine returned no output '${set.output}' for case ${c.ordinal + 1}`)
      rows.push({
        setId,
        ordinal: c.ordinal,
        inputs: c.inputs,
        inputKey: c.key,
        referenceValue: out.value,
        certifiedDigits: out.digits,
        conditionNumber: out.kappa,
        region: c.region,
        certification: r.certification,
      })
    })
    await db.update(referenceSets).set({ casesDone: Math.min(i + CHUNK, grid.length) }).where(eq(referenceSets.id, setId))
    await new Promise(resolve => setImmediate(resolve))
  }

  await db.transaction(async (tx) => {
    for (let i = 0; i < rows.length; i += INSERT_BATCH) {
      await tx.insert(cases).values(rows.slice(i, i + INSERT_BATCH))
    }
    await tx.update(referenceSets).set({ state: 'ready', casesDone: rows.length, caseCount: rows.length }).where(eq(referenceSets.id, setId))
    await finish(tx, jobId)
  })
}

export async function markSetFailed(db: Db, setId: number, message: string) {
  await db.update(referenceSets).set({ state: 'failed', error: message }).where(eq(referenceSets.id, setId))
}
