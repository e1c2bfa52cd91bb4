/**
 * parseTable: bytes as uploaded → columns, rows of fields, and every problem
 * found, each with its line and column. The caller refuses a file with any
 * issue; the first MAX_LISTED_ERRORS are listed and all are counted.
 */
import { decodeTable } from './decode'
import { detectFormat } from './detect'
import { scanDelimited, type CommentLine } from './delimited'
import { JsonSyntaxError, readJson } from './json-reader'
import { jsonToTable } from './json-table'
import { isNumericKind, parseNumber } from './number'
import {
  MAX_LISTED_ERRORS, MAX_TABLE_BYTES, MAX_TABLE_ROWS,
  type Field, type ParseIssue, type ParseOptions, type ParsedTable, type Row, type TableFormat,
} from './types'

/** Collects issues in order, keeping the first MAX_LISTED_ERRORS and counting all. */
class IssueList {
  readonly listed: ParseIssue[] = []
  count = 0
  add(issue: ParseIssue): void {
    this.count++
    if (this.listed.length < MAX_LISTED_ERRORS) this.listed.push(issue)
  }
  get full(): boolean { return this.listed.length >= MAX_LISTED_ERRORS }
}

const byPosition = (a: ParseIssue, b: ParseIssue): number => a.line - b.line || a.column - b.column

function megabytes(n: number): string {
  return `${(n / (1024 * 1024)).toFixed(1)} MB`
}

export function parseTable(bytes: Uint8Array, options: ParseOptions = {}): ParsedTable {
  const empty = { columns: [], numeric: [], rows: [], headerFound: false }
  if (bytes.length > MAX_TABLE_BYTES) {
    const message = `the file is ${megabytes(bytes.length)}; the limit is ${megabytes(MAX_TABLE_BYTES)}. Split the table or drop columns that are not needed`
    return { format: 'unknown', delimiter: '', encoding: 'unknown', bom: false, ...empty, errors: [{ kind: 'too-large', line: 0, column: 0, message }], errorCount: 1 }
  }
  const decoded = decodeTable(bytes)
  const base = { encoding: decoded.encoding, bom: decoded.bom }
  const tooMany = (count: number, what: 'lines' | 'rows') => ({
    format: 'unknown' as const, delimiter: '', ...base, ...empty, errorCount: 1,
    errors: [{ kind: 'too-large' as const, line: 0, column: 0, message: `the table has ${count.toLocaleString('en')} ${what}; the limit is ${MAX_TABLE_ROWS.toLocaleString('en')} rows, twice the largest reference set. Split the table by reference set` }],
  })
  const lines = lineCount(decoded.text)
  if (lines > MAX_TABLE_ROWS + 1000) return tooMany(lines, 'lines') // room for header and comment lines
  const early: ParseIssue[] = []
  if (decoded.problem) early.push({ kind: 'encoding', line: 0, column: 0, message: decoded.problem })

  const detected = detectFormat(decoded.text, options)
  let names: string[] | null = null
  let records: Row[]
  let comments: CommentLine[] = []
  if (detected.format === 'json') {
    try {
      const t = jsonToTable(readJson(decoded.text), options.header)
      if (t.records.length > MAX_TABLE_ROWS) return tooMany(t.records.length, 'rows')
      names = t.columns
      records = t.records
      early.push(...t.issues)
    } catch (e) {
      if (!(e instanceof JsonSyntaxError)) throw e
      early.push(e.issue)
      records = []
    }
  } else {
    const scan = scanDelimited(decoded.text, detected.delimiter)
    records = scan.records
    comments = scan.leadingComments
    early.push(...scan.issues)
    if (options.header === true || (options.header === undefined && looksLikeHeader(records[0]))) {
      const head = records[0]!.fields
      // A line that ends with its delimiter leaves an empty last name.
      if (head.length > 1 && head[head.length - 1]!.raw === '') head.pop()
      names = head.map((f) => f.raw)
      records = records.slice(1)
    }
  }
  const format: TableFormat = detected.format
  const delimiter = detected.format === 'whitespace' ? ' ' : detected.delimiter ?? ''
  if (names === null && options.header !== false) names = commentedHeader(comments, detected.delimiter, records[0])
  const headerFound = names !== null
  const width = names?.length ?? modalWidth(records)
  const columns = uniqueNames(names ?? Array.from({ length: width }, (_, i) => `col${i + 1}`))

  const issues = new IssueList()
  if (records.length === 0 && early.length === 0) {
    issues.add({ kind: 'no-data', line: 0, column: 0, message: 'the file holds no data rows; check that it is the table the code wrote' })
  }
  const numeric = numericColumns(columns, records, options.numericColumns, issues)
  // A field the JSON reader already reported is not reported twice.
  const reported = new Set(early.map((e) => `${e.line}:${e.column}`))
  for (const row of records) {
    dropTrailingEmpty(row, width, format)
    if (format === 'whitespace' && row.fields.length < width) splitStarRuns(row, width)
    if (row.fields.length !== width) issues.add(countIssue(row, columns))
    if (issues.full) { countRest(row, numeric, columns, issues); continue }
    const m = Math.min(width, row.fields.length)
    for (let j = 0; j < m; j++) {
      const f = row.fields[j]!
      if (f.kind === 'text' && numeric[j] && !reported.has(`${f.line}:${f.column}`)) issues.add(numberIssue(f, columns[j]!))
    }
  }
  early.sort(byPosition)
  const merged = [...early.slice(0, MAX_LISTED_ERRORS), ...issues.listed].sort(byPosition).slice(0, MAX_LISTED_ERRORS)
  return { format, delimiter, ...base, headerFound, columns, numeric, rows: records, errors: merged, errorCount: early.length + issues.count }
}

/** Lines in the text, whichever line end it uses (LF, CRLF or a lone CR). */
function lineCount(text: string): number {
  let lf = 0
  let cr = 0
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) lf++
  if (lf === 0) for (let i = text.indexOf('\r'); i !== -1; i = text.indexOf('\r', i + 1)) cr++
  return Math.max(lf, cr) + 1
}

/**
 * With no header, the most common field count sets the width (a bad first
 * row must not decide it), less one when that last field is always empty.
 */
function modalWidth(rows: Row[]): number {
  const tally = new Map<number, number>()
  for (const r of rows) tally.set(r.fields.length, (tally.get(r.fields.length) ?? 0) + 1)
  let width = 0, top = 0
  for (const [w, k] of tally) if (k > top || (k === top && w < width)) { width = w; top = k }
  if (width > 1 && rows.every((r) => r.fields.length !== width || r.fields[width - 1]!.kind === 'empty')) width--
  return width
}

/** A header has at least one text field and no finite numbers. */
function looksLikeHeader(row: Row | undefined): boolean {
  if (!row) return false
  let text = false
  for (const f of row.fields) {
    if (f.kind === 'number') return false
    if (f.kind === 'text') text = true
  }
  return text
}

/**
 * numpy.savetxt(header=…) and many codes write the column names as the last
 * comment line before the data (common practice). It is taken as the header
 * when it splits into as many names as the first row has fields.
 */
function commentedHeader(comments: CommentLine[], delimiter: string | null, first: Row | undefined): string[] | null {
  const last = comments[comments.length - 1]
  if (!last || !first) return null
  const body = last.text.replace(/^(?:\/\/|[#!%])+/, '').trim()
  const parts = (delimiter === null ? body.split(/[ \t]+/) : body.split(delimiter)).map((s) => s.trim().replace(/^"(.*)"$/, '$1'))
  if (parts.length !== first.fields.length || parts.some((p) => p === '' || parseNumber(p).kind !== 'text')) return null
  return parts
}

function uniqueNames(names: string[]): string[] {
  const seen = new Map<string, number>()
  return names.map((raw, i) => {
    const name = raw.trim() === '' ? `col${i + 1}` : raw.trim()
    const k = (seen.get(name) ?? 0) + 1
    seen.set(name, k)
    return k === 1 ? name : `${name}_${k}`
  })
}

/** Writers that end every line with the delimiter leave one empty field too many. */
function dropTrailingEmpty(row: Row, width: number, format: TableFormat): void {
  if (format === 'json' || row.fields.length !== width + 1) return
  if (row.fields[width]!.kind === 'empty') row.fields.pop()
}

/**
 * Fixed-width Fortran output has no blank between fields, so an overflowed
 * field glues onto its neighbour: `2.000**************`. A number never
 * holds `*`, so such a token is split at the asterisk runs when that gives
 * the row exactly the width it lacks.
 */
function splitStarRuns(row: Row, width: number): void {
  let extra = 0
  const parts = row.fields.map((f) => {
    if (!f.raw.includes('*') || /^\*+$/.test(f.raw)) return [f]
    const pieces = f.raw.match(/\*+|[^*]+/g) ?? [f.raw]
    extra += pieces.length - 1
    let at = f.column
    return pieces.map((raw) => {
      const r = parseNumber(raw)
      const g: Field = { raw, line: f.line, column: at, kind: r.kind, value: r.value, sign: r.sign, problem: r.problem }
      at += raw.length
      return g
    })
  })
  if (row.fields.length + extra === width) row.fields = parts.flat()
}

function numericColumns(columns: string[], rows: Row[], wanted: string[] | undefined, issues: IssueList): boolean[] {
  if (wanted) {
    for (const w of wanted) {
      if (!columns.includes(w)) {
        issues.add({ kind: 'missing-column', line: 0, column: 0, field: w, message: `the table has no column "${w}"; its columns are ${columns.map((c) => `"${c}"`).join(', ')}` })
      }
    }
    return columns.map((c) => wanted.includes(c))
  }
  return columns.map((_, j) => {
    let num = 0, text = 0
    for (const r of rows) {
      const k = r.fields[j]?.kind
      if (k === undefined || k === 'empty') continue
      if (isNumericKind(k) || looksNumeric(r.fields[j]!.raw)) num++
      else text++
    }
    return num > 0 && num >= text
  })
}

/** Text that a person meant as a number (`1.2.3`, `12-3`, `1,5`) votes for a numeric column. */
const looksNumeric = (raw: string): boolean => /^[+-]?\.?\d/.test(raw)

function countIssue(row: Row, columns: string[]): ParseIssue {
  const got = row.fields.length, want = columns.length
  const list = columns.map((c) => `"${c}"`).join(', ')
  if (got > want) {
    const extra = row.fields[want]!
    return {
      kind: 'field-count', line: row.line, column: extra.column,
      message: `line ${row.line}, column ${extra.column}: this row has ${got} fields but the table has ${want} (${list}); the extra field starts here`,
    }
  }
  const last = row.fields[got - 1]
  const column = last ? last.column + last.raw.length : 1
  const runTogether = row.fields.some((f) => f.problem?.startsWith('it looks like fields that ran together'))
  return {
    kind: 'field-count', line: row.line, column, field: columns[got],
    message: `line ${row.line}, column ${column}: this row has ${got} field${got === 1 ? '' : 's'} but the table has ${want} (${list}); "${columns[got]}" is missing${runTogether ? ' (some fields seem to have run together with no space between them)' : ''}`,
  }
}

function numberIssue(f: Field, name: string): ParseIssue {
  const shown = f.raw.length > 40 ? `${f.raw.slice(0, 40)}…` : f.raw
  return {
    kind: 'not-a-number', line: f.line, column: f.column, field: name,
    message: `line ${f.line}, column ${f.column} (field "${name}"): ${JSON.stringify(shown)} is not a number${f.problem ? `; ${f.problem}` : ''}`,
  }
}

/** Past the listing cap only the count matters. */
function countRest(row: Row, numeric: boolean[], columns: string[], issues: IssueList): void {
  const m = Math.min(columns.length, row.fields.length)
  for (let j = 0; j < m; j++) if (row.fields[j]!.kind === 'text' && numeric[j]) issues.count++
}
