// The run store's bulk load (server/utils/load-data.ts) through the real
// MariaDB: awkward text survives LOAD DATA's escapes byte for byte, NULLs stay
// NULL, and non-finite sort keys become NULL. Rolled back, so nothing stays.
import { Readable } from 'node:stream'
import { createConnection, type ResultSetHeader, type RowDataPacket } from 'mysql2/promise'
import { describe, expect, it } from 'vitest'
import { LOAD_RESULTS, resultsTsv, type ResultRow } from '../../server/utils/load-data'

const awkward: ResultRow[] = [
  { runId: 0, caseId: null, lineNumber: 7, inputs: { n: 'a\\b', x: 'tab\there "quoted"' }, measured: 'back\\slash\nnew line\r\0nul', absError: null, relError: null, ulps: null, digitsAgreed: null, region: 'zone\\N', relErrorKey: Number.POSITIVE_INFINITY, absErrorKey: Number.NaN, ulpsKey: null, verdict: 'unexpected', decidedBy: 'no-case' },
  { runId: 0, caseId: 12, lineNumber: 8, inputs: null, measured: '\\N', absError: '1.000e-17', relError: '2.500e-16', ulps: '1.125e+0', digitsAgreed: '15.6', region: 'all', relErrorKey: 2.5e-16, absErrorKey: 1e-17, ulpsKey: 1.125, verdict: 'pass', decidedBy: 'ulps' },
]

describe('bulk load of case results', () => {
  it('keeps every field exactly, NULL as NULL', async () => {
    const conn = await createConnection(process.env.NUXT_DATABASE_URL!)
    try {
      await conn.beginTransaction()
      await conn.query('SET foreign_key_checks = 0')
      const tsv = resultsTsv(0, awkward)
      const [header] = await conn.query({ sql: LOAD_RESULTS, infileStreamFactory: () => Readable.from([tsv]) } as never) as [ResultSetHeader, unknown]
      expect(header.affectedRows).toBe(2)
      expect(header.warningStatus).toBe(0)
      const [rows] = await conn.query<RowDataPacket[]>('SELECT * FROM case_results WHERE run_id = 0 ORDER BY line_number')
      expect(rows).toHaveLength(2)
      expect(rows[0]).toMatchObject({ case_id: null, line_number: 7, measured: 'back\\slash\nnew line\r\0nul', region: 'zone\\N', rel_error_key: null, abs_error_key: null, verdict: 'unexpected' })
      const inputs = typeof rows[0]!.inputs === 'string' ? JSON.parse(rows[0]!.inputs) : rows[0]!.inputs
      expect(inputs).toEqual({ n: 'a\\b', x: 'tab\there "quoted"' })
      expect(rows[1]).toMatchObject({ case_id: 12, inputs: null, measured: '\\N', abs_error: '1.000e-17', rel_error: '2.500e-16', ulps: '1.125e+0', digits_agreed: '15.6', rel_error_key: 2.5e-16, ulps_key: 1.125, verdict: 'pass', decided_by: 'ulps' })
    }
    finally {
      await conn.rollback().catch(() => {})
      await conn.end()
    }
  })
})
