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
  return NEEDS_ESCAPE.test(v) ? v.replace(ESCAPE_ALL, c => ESCAPES[c]!) : v
}
const NEEDS_ESCAPE = /[\\\t\n\r\0]/
const ESCAPE_ALL = /[\\\t\n\r\0]/g
const ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r', '\0': '\\0' }

/**
 * The rows of one chunk in LOAD DATA's text format, columns as
 * RESULT_COLUMNS. One template string per row: the free-text fields
 * (inputs, measured, region, decided by) go through tsvField; the rest are
 * numbers or the judge's own short strings, which never hold a character
 * that needs escaping.
 */
export function resultsTsv(runId: number, rows: ResultRow[]): Buffer {
  let out = ''
  for (const r of rows) {
    out += `${runId}\t${tsvField(r.caseId)}\t${tsvField(r.lineNumber)}\t${r.inputs ? tsvField(JSON.stringify(r.inputs)) : '\\N'}\t${tsvField(r.measured)}\t`
      + `${plain(r.absError)}\t${plain(r.relError)}\t${plain(r.ulps)}\t${plain(r.digitsAgreed)}\t${tsvField(r.region)}\t`
      + `${tsvField(r.relErrorKey)}\t${tsvField(r.absErrorKey)}\t${tsvField(r.ulpsKey)}\t${r.verdict}\t${tsvField(r.decidedBy)}\n`
  }
  return Buffer.from(out, 'utf8')
}

/** A judge-made figure such as 1.234e-5 (digits, sign, point, e): written as it is. */
const plain = (v: string | null | undefined) => (v === null || v === undefined ? '\\N' : v)
