// Every solver-style table in fixtures/tables goes through the real server:
// a reference set is made from the file's own (n, x) points, the file is
// uploaded unchanged, and every row must match a case (none missing, none
// unexpected but rows whose inputs lie outside the function's domain), whatever the format, encoding or number spelling.
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { parseTable, suggestColumnMapping } from '../../shared/parse'
import { inputKey } from '../../shared/grid'
import { validateParams } from '../../shared/reference'
import { type Client, signedIn, unique } from '../support/api'
import { hermiteSet, readySet, upload } from '../support/sets'

const dir = join(import.meta.dirname, '../../fixtures/tables')
const files = readdirSync(dir).filter(f => !f.endsWith('.py') && f !== 'bad-rows.csv').sort()

let qa: Client
beforeAll(async () => {
  qa = await signedIn('qa')
})

describe('fixture tables through the server', () => {
  it.each(files)('%s: every row matches a case and is judged', async (file) => {
    const bytes = new Uint8Array(readFileSync(join(dir, file)))
    const table = parseTable(bytes)
    const isPsi = table.columns.includes('psi')
    const { mapping } = suggestColumnMapping(table.columns, ['n', 'x'])
    const col = (name: string) => table.columns.indexOf(mapping[name]!)
    const fn = isPsi ? 'hermite-function' : 'hermite'
    const exact = (f: { kind: string, value?: string, raw: string }) => (f.kind === 'number' ? f.value! : f.raw)
    const points = new Map<string, { n: string, x: string }>()
    let outside = 0 // rows whose inputs are no case of any set (NaN, or past the domain): `unexpected`
    for (const r of table.rows) {
      const p = { n: exact(r.fields[col('n')]!), x: exact(r.fields[col('x')]!) }
      try {
        validateParams(fn, p)
        points.set(inputKey(p, fn), p)
      }
      catch {
        outside++
      }
    }
    const set = await readySet(qa, hermiteSet(unique('fx'), {
      functionId: fn,
      targetDigits: 40,
      grid: { parts: [{ kind: 'points', points: [...points.values()] }] },
      criterion: { format: isPsi ? 'binary128' : 'binary64', tolerance: { kind: 'relative', rtol: '1e-10' }, zero: { below: '1e-300', atol: '1e-300' }, overflow: { signedInf: 'pass' } },
    }))
    const r = await upload(qa, '/api/runs', { code: 'modeforge', version: unique('fx'), setId: String(set.id), mapping: JSON.stringify(mapping) }, { name: file, content: bytes })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const c = r.body.run.counts
    expect(c.missing).toBe(0)
    expect(c.unexpected).toBe(outside)
    expect(c.pass + c.fail + c.non_finite + c.duplicate + c.unexpected).toBe(table.rows.length)
    // the values are honest H_n(x) (or ψ_n) printings: most pass
    expect(c.pass).toBeGreaterThan(0)
  })

  it('bad-rows.csv is refused whole with line and column, and nothing is stored', async () => {
    const bytes = new Uint8Array(readFileSync(join(dir, 'bad-rows.csv')))
    const set = await readySet(qa, hermiteSet(unique('fx-bad')))
    const r = await upload(qa, '/api/runs', { code: 'modeforge', version: unique('fx-bad'), setId: String(set.id) }, { name: 'bad-rows.csv', content: bytes })
    expect(r.status).toBe(400)
    expect(r.body.data.errorCount).toBe(6)
    expect(r.body.data.errors[0]).toMatchObject({ line: 4, column: expect.any(Number) })
  })
})
