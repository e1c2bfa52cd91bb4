/**
 * Record scanner for delimited text: CSV and TSV (RFC 4180 quoting, any
 * one-character delimiter) and whitespace-separated columns.
 *
 * - Line ends: CRLF, LF or a lone CR (RFC 4180 §2 says CRLF; the others are
 *   common practice).
 * - Quoting (csv/tsv only): a field that starts with `"` runs to the next
 *   lone `"`; `""` inside stands for one quote; delimiters and line ends
 *   inside are kept (RFC 4180 §2, rules 5–7). Blanks around a quoted field
 *   are allowed (common practice).
 * - Unquoted fields keep their text with surrounding blanks trimmed; the
 *   column is the position of the first non-blank character.
 * - Blank lines are skipped. A line whose first non-blank characters are
 *   `#`, `!`, `%` or `//` is a comment (shell/Python, Fortran, MATLAB/Octave,
 *   C++ conventions; common practice). In whitespace mode a token that starts
 *   with one of these ends the line as a trailing comment.
 * - Fixed-form `C ` comments are not recognised: in a table, a `C` in column
 *   one is as likely to be a column name.
 */
import { readInto } from './number'
import type { Field, ParseIssue, Row } from './types'

export interface CommentLine {
  line: number
  text: string
}

export interface ScanResult {
  records: Row[]
  /** Comment lines that come before the first record. */
  leadingComments: CommentLine[]
  issues: ParseIssue[]
}

const TAB = 9, LF = 10, CR = 13, SPACE = 32, QUOTE = 34, HASH = 35, BANG = 33, PERCENT = 37, SLASH = 47

const isBlank = (c: number): boolean => c === SPACE || c === TAB

function makeField(raw: string, line: number, column: number): Field {
  const f: Field = { raw, line, column, kind: 'empty', value: undefined, sign: undefined, problem: undefined }
  readInto(f, raw)
  return f
}

function isCommentStart(text: string, i: number): boolean {
  const c = text.charCodeAt(i)
  return c === HASH || c === BANG || c === PERCENT || (c === SLASH && text.charCodeAt(i + 1) === SLASH)
}

/** Position just past the line end at `pos` (or `pos` itself at the end of the text). */
function pastLineEnd(text: string, pos: number): number {
  const c = text.charCodeAt(pos)
  if (c === CR) return text.charCodeAt(pos + 1) === LF ? pos + 2 : pos + 1
  return c === LF ? pos + 1 : pos
}

/**
 * Scan `text`; `delimiter` null means whitespace-separated. One flat loop
 * with local counters (no closures), as it runs once per character.
 */
export function scanDelimited(text: string, delimiter: string | null): ScanResult {
  const records: Row[] = []
  const leadingComments: CommentLine[] = []
  const issues: ParseIssue[] = []
  const n = text.length
  const d = delimiter === null ? -1 : delimiter.charCodeAt(0)
  const padTab = d !== TAB // in TSV a tab is the delimiter, not padding; spaces still are
  let pos = 0
  let line = 1
  let lineStart = 0

  while (pos < n) {
    let p = pos
    while (p < n && isBlank(text.charCodeAt(p))) p++
    const first = p < n ? text.charCodeAt(p) : LF
    if (first === LF || first === CR || isCommentStart(text, p)) {
      let e = p
      while (e < n) { const c = text.charCodeAt(e); if (c === LF || c === CR) break; e++ }
      if (first !== LF && first !== CR && records.length === 0) leadingComments.push({ line, text: text.slice(p, e) })
      pos = pastLineEnd(text, e)
      line++
      lineStart = pos
      continue
    }
    const fields: Field[] = []
    const rowLine = line
    if (d < 0) {
      // Whitespace-separated tokens up to the line end or a trailing comment.
      pos = p
      while (pos < n) {
        const c = text.charCodeAt(pos)
        if (c === LF || c === CR) break
        if (c === SPACE || c === TAB) { pos++; continue }
        if (isCommentStart(text, pos)) {
          while (pos < n) { const k = text.charCodeAt(pos); if (k === LF || k === CR) break; pos++ }
          break
        }
        const start = pos
        while (pos < n) {
          const k = text.charCodeAt(pos)
          if (k === SPACE || k === TAB || k === LF || k === CR) break
          pos++
        }
        fields.push(makeField(text.slice(start, pos), line, start - lineStart + 1))
      }
    } else {
      for (;;) {
        // One field starts at pos.
        let s = pos
        while (s < n) { const c = text.charCodeAt(s); if (c === SPACE || (padTab && c === TAB)) s++; else break }
        if (text.charCodeAt(s) === QUOTE) {
          const qLine = line, qCol = s - lineStart + 1
          let value = ''
          let q = s + 1
          let close = -1
          for (;;) {
            const next = text.indexOf('"', q)
            if (next < 0) break
            value += text.slice(q, next)
            if (text.charCodeAt(next + 1) === QUOTE) { value += '"'; q = next + 2; continue }
            close = next
            break
          }
          fields.push(makeField(value, qLine, qCol))
          if (close < 0) {
            issues.push({ kind: 'syntax', line: qLine, column: qCol, message: `line ${qLine}, column ${qCol}: the quote opened here is never closed, so the rest of the file cannot be read` })
            records.push({ line: rowLine, fields })
            return { records, leadingComments, issues }
          }
          // Line ends inside the quotes move the line counter.
          for (let k = s; k < close; k++) {
            const c = text.charCodeAt(k)
            if (c === CR || c === LF) {
              if (c === CR && text.charCodeAt(k + 1) === LF) k++
              line++
              lineStart = k + 1
            }
          }
          pos = close + 1
          while (pos < n) { const c = text.charCodeAt(pos); if (c === SPACE || (padTab && c === TAB)) pos++; else break }
          const after = text.charCodeAt(pos)
          if (pos < n && after !== d && after !== LF && after !== CR) {
            const col = pos - lineStart + 1
            issues.push({ kind: 'syntax', line, column: col, message: `line ${line}, column ${col}: text follows a closing quote; put the whole field in quotes or none of it` })
            while (pos < n) { const k = text.charCodeAt(pos); if (k === d || k === LF || k === CR) break; pos++ }
          }
        } else {
          let e = s
          while (e < n) { const k = text.charCodeAt(e); if (k === d || k === LF || k === CR) break; e++ }
          let t = e
          while (t > s) { const c = text.charCodeAt(t - 1); if (c === SPACE || (padTab && c === TAB)) t--; else break }
          fields.push(makeField(text.slice(s, t), line, s - lineStart + 1))
          pos = e
        }
        if (pos < n && text.charCodeAt(pos) === d) { pos++; continue }
        break
      }
    }
    records.push({ line: rowLine, fields })
    pos = pastLineEnd(text, pos)
    line++
    lineStart = pos
  }
  return { records, leadingComments, issues }
}
