// Case results in the text format of MariaDB's LOAD DATA (its defaults:
// tab-separated fields, newline-terminated lines, backslash escapes, \N for
// NULL). Pure, so tests can load rows through it directly.
import type { caseResults } from '../database/schema'

export const RESULT_COLUMNS = ['run_id', 'case_id', 'line_number', 'inputs', 'measured', 'abs_error', 'rel_error', 'ulps', 'digits_agreed',
  'region', 'rel_error_key', 'abs_error_key', 'ulps_key', 'verdict', 'decided_by'] as const

export const LOAD_RESULTS = `LOAD DATA LOCAL INFILE 'case-results.tsv' INTO TABLE case_results CHARACTER SET utf8mb4
  FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${RESULT_COLUMNS.join(', ')})`

export type ResultRow = typeof caseResults.$inferInsert

/** One field of LOAD DATA's default text format: \N for NULL; backslash, tab, newline, CR and NUL escaped. */
export function tsvField(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '\\N'
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '\\N'
  return /[\\\t\n\r\0]/.test(v) ? v.replace(/[\\\t\n\r\0]/g, c => ESCAPES[c]!) : v
}
const ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r', '\0': '\\0' }

/** The rows of one chunk in LOAD DATA's text format, columns as RESULT_COLUMNS. */
export function resultsTsv(runId: number, rows: ResultRow[]): Buffer {
  const lines = rows.map(r => [runId, r.caseId, r.lineNumber, r.inputs ? JSON.stringify(r.inputs) : null, r.measured,
    r.absError, r.relError, r.ulps, r.digitsAgreed, r.region,
    r.relErrorKey, r.absErrorKey, r.ulpsKey, r.verdict, r.decidedBy].map(tsvField).join('\t'))
  return Buffer.from(lines.join('\n') + '\n', 'utf8')
}
