/**
 * JSON layouts read as tables (the documented set):
 * 1. an array of objects, `[{"n":0,"x":"0.5","H":1}, …]`: the columns are
 *    the keys in order of first appearance; an object that lacks a key is an
 *    error;
 * 2. an array of arrays, `[["n","x","H"],[0,0.5,1], …]`: the first array is
 *    the header when it holds only strings that are not numbers (or when
 *    the caller says so);
 * 3. an object `{"columns":["n","x","H"],"rows":[[0,0.5,1], …]}`; `data`
 *    may stand for `rows`.
 * Every field, whether a JSON number, a bare token or a string, is read by
 * `parseNumber` from its source text.
 */
import { parseNumber, readInto } from './number'
import type { JValue } from './json-reader'
import type { Field, ParseIssue, Row } from './types'

export interface JsonTable {
  /** Column names when the layout carries them. */
  columns: string[] | null
  records: Row[]
  issues: ParseIssue[]
}

const LAYOUTS = 'a table in JSON must be an array of objects, an array of arrays, or {"columns": [...], "rows": [[...]]}'

function field(raw: string, v: JValue, kind: Field['kind']): Field {
  return { raw, line: v.line, column: v.column, kind, value: undefined, sign: undefined, problem: undefined }
}

function fieldOf(v: JValue, issues: ParseIssue[], name: string | undefined): Field {
  const where = `line ${v.line}, column ${v.column}${name ? ` (field "${name}")` : ''}`
  if (v.t === 'str') {
    const f = field(v.s, v, 'empty')
    readInto(f, v.s)
    return f
  }
  if (v.t === 'tok') {
    if (v.s === 'null') return field(v.s, v, 'empty')
    if (v.s === 'true' || v.s === 'false') return field(v.s, v, 'text')
    const f = field(v.s, v, 'empty')
    readInto(f, v.s)
    if (f.kind === 'text') issues.push({ kind: 'syntax', line: v.line, column: v.column, field: name, message: `${where}: ${v.s} is neither a JSON value nor a number; put text in quotes` })
    return f
  }
  issues.push({ kind: 'syntax', line: v.line, column: v.column, field: name, message: `${where}: a nested ${v.t === 'arr' ? 'array' : 'object'} cannot be a table field` })
  return field('', v, 'text')
}

export function jsonToTable(root: JValue, header: boolean | undefined): JsonTable {
  const issues: ParseIssue[] = []
  if (root.t === 'obj') {
    const ci = root.keys.indexOf('columns')
    const ri = root.keys.indexOf('rows') >= 0 ? root.keys.indexOf('rows') : root.keys.indexOf('data')
    const cols = ci >= 0 ? root.vals[ci] : undefined
    const rows = ri >= 0 ? root.vals[ri] : undefined
    if (!cols || cols.t !== 'arr' || !rows || rows.t !== 'arr' || cols.items.some((c) => c.t !== 'str')) {
      return { columns: null, records: [], issues: [whole(root, LAYOUTS)] }
    }
    return { columns: cols.items.map((c) => (c.t === 'str' ? c.s : '')), records: arrayRows(rows.items, issues), issues }
  }
  if (root.t !== 'arr') return { columns: null, records: [], issues: [whole(root, LAYOUTS)] }
  const items = root.items
  if (items.length > 0 && items.every((it) => it.t === 'obj')) return objectRows(items, issues)
  if (items.every((it) => it.t === 'arr')) {
    const first = items[0]
    const looksLikeHeader = first?.t === 'arr' && first.items.length > 0
      && first.items.every((c) => c.t === 'str' && parseNumber(c.s).kind === 'text')
    if (first?.t === 'arr' && (header === true || (header === undefined && looksLikeHeader))) {
      const columns = first.items.map((c) => (c.t === 'str' || c.t === 'tok' ? c.s : ''))
      return { columns, records: arrayRows(items.slice(1), issues), issues }
    }
    return { columns: null, records: arrayRows(items, issues), issues }
  }
  const odd = items.find((it) => it.t !== (items[0]?.t ?? 'arr')) ?? root
  return { columns: null, records: [], issues: [whole(odd, `${LAYOUTS}; this item does not match the first one`)] }
}

function whole(v: JValue, message: string): ParseIssue {
  return { kind: 'syntax', line: v.line, column: v.column, message: `line ${v.line}, column ${v.column}: ${message}` }
}

function arrayRows(items: JValue[], issues: ParseIssue[]): Row[] {
  const out: Row[] = []
  for (const it of items) {
    if (it.t !== 'arr') { issues.push(whole(it, 'each row must be an array')); continue }
    out.push({ line: it.line, fields: it.items.map((v) => fieldOf(v, issues, undefined)) })
  }
  return out
}

function objectRows(items: JValue[], issues: ParseIssue[]): JsonTable {
  const columns: string[] = []
  const index = new Map<string, number>()
  for (const it of items) {
    if (it.t !== 'obj') continue
    for (const k of it.keys) if (!index.has(k)) { index.set(k, columns.length); columns.push(k) }
  }
  const records: Row[] = []
  for (const it of items) {
    if (it.t !== 'obj') continue
    const fields: Array<Field | undefined> = new Array<Field | undefined>(columns.length)
    it.keys.forEach((k, i) => {
      const j = index.get(k)!
      if (fields[j]) {
        issues.push({ kind: 'syntax', line: it.vals[i]!.line, column: it.vals[i]!.column, field: k, message: `line ${it.vals[i]!.line}, column ${it.vals[i]!.column}: the key "${k}" appears twice in this object` })
        return
      }
      fields[j] = fieldOf(it.vals[i]!, issues, k)
    })
    const missing = columns.filter((_, j) => !fields[j])
    if (missing.length > 0) {
      issues.push({
        kind: 'field-count', line: it.line, column: it.column, field: missing[0],
        message: `line ${it.line}, column ${it.column}: this object has no ${missing.map((m) => `"${m}"`).join(', ')}; every row needs every column`,
      })
    }
    records.push({
      line: it.line,
      fields: columns.map((_, j) => fields[j] ?? { raw: '', line: it.line, column: it.column, kind: 'empty', value: undefined, sign: undefined, problem: undefined }),
    })
  }
  return { columns, records, issues }
}
