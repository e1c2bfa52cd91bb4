// Output tables made from a set's own certified values (so every case passes
// unless a test spoils it), and direct reads of the test database.
import { expect } from 'vitest'
import type { Client } from './api'
import { upload } from './sets'
import { dbQuery } from './db'

export type Spoil = (inputs: Record<string, string>) => 'off' | 'nan' | null

/** A CSV of the set's cases: value written with 17 digits (within one ULP), `off` ones 1e-9 relative away, `nan` ones NaN. */
export async function tableFromSet(client: Client, setId: number, spoil: Spoil = () => null): Promise<string> {
  const res = await client.get(`/api/reference-sets/${setId}/values?format=json`)
  expect(res.status).toBe(200)
  const cases = res.body.cases as Array<{ inputs: Record<string, string>, value: string }>
  const params = Object.keys(cases[0]!.inputs)
  const lines = [[...params, 'value'].join(',')]
  for (const c of cases) {
    const how = spoil(c.inputs)
    const v = how === 'nan' ? 'NaN' : how === 'off' ? (Number(c.value) * (1 + 1e-9)).toPrecision(17) : Number(c.value).toPrecision(17)
    lines.push([...params.map(p => c.inputs[p]), v].join(','))
  }
  return lines.join('\n') + '\n'
}

/** Submit a table for a code version; returns the run id. */
export async function submitTable(client: Client, code: string, version: string, setId: number, content: string): Promise<number> {
  const r = await upload(client, '/api/runs', { code, version, setId: String(setId) }, { name: `${code}-${version}.csv`, content })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return r.body.run.id as number
}


/** A semantic-version minor number no other test run in this database uses. */
export const freshMinor = () => 100 + Math.floor(Math.random() * 899_900)

/** Direct SQL for tests (tests/support/db.ts). */
export const sql = dbQuery
