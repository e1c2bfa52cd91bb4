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
import { parseNumber } from './number'
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
  const r = parseNumber(raw)
  return { raw, line, column, kind: r.kind, value: r.value, sign: r.sign, problem: r.problem }
}

function isCommentStart(text: string, i: number): boolean {
  const c = text.charCodeAt(i)
  return c === HASH || c === BANG || c === PERCENT || (c === SLASH && text.charCodeAt(i + 1) === SLASH)
}

/** Scan `text`; `delimiter` null means whitespace-separated. */
export function scanDelimited(text: string, delimiter: string | null): ScanResult {
  const records: Row[] = []
  const leadingComments: CommentLine[] = []
  const issues: ParseIssue[] = []
  const n = text.length
  const d = delimiter === null ? -1 : delimiter.charCodeAt(0)
  // In TSV a tab is the delimiter, not padding; spaces still are.
  const isPad = d === TAB ? (c: number): boolean => c === SPACE : isBlank
  let pos = 0
  let line = 1
  let lineStart = 0

  const endLine = (): void => {
    const c = text.charCodeAt(pos)
    if (c === CR) pos += text.charCodeAt(pos + 1) === LF ? 2 : 1
    else if (c === LF) pos += 1
    line++
    lineStart = pos
  }
  const toLineEnd = (): void => {
    while (pos < n) {
      const c = text.charCodeAt(pos)
      if (c === LF || c === CR) break
      pos++
    }
  }

  while (pos < n) {
    let p = pos
    while (p < n && isBlank(text.charCodeAt(p))) p++
    const first = text.charCodeAt(p)
    if (p >= n || first === LF || first === CR) { pos = p; if (pos < n) endLine(); continue }
    if (isCommentStart(text, p)) {
      pos = p
      toLineEnd()
      if (records.length === 0) leadingComments.push({ line, text: text.slice(p, pos) })
      if (pos < n) endLine()
      continue
    }
    const row: Row = { line, fields: [] }
    if (d < 0) {
      // Whitespace-separated tokens up to the line end or a trailing comment.
      pos = p
      while (pos < n) {
        const c = text.charCodeAt(pos)
        if (c === LF || c === CR) break
        if (isBlank(c)) { pos++; continue }
        if (isCommentStart(text, pos)) { toLineEnd(); break }
        const start = pos
        while (pos < n) {
          const k = text.charCodeAt(pos)
          if (k === SPACE || k === TAB || k === LF || k === CR) break
          pos++
        }
        row.fields.push(makeField(text.slice(start, pos), line, start - lineStart + 1))
      }
      records.push(row)
      if (pos < n) endLine()
      continue
    }
    for (;;) {
      // One field starts at pos.
      let s = pos
      while (s < n && isPad(text.charCodeAt(s))) s++
      if (text.charCodeAt(s) === QUOTE) {
        const qLine = line, qCol = s - lineStart + 1
        let value = ''
        let q = s + 1
        let closed = false
        for (;;) {
          const next = text.indexOf('"', q)
          if (next < 0) break
          value += text.slice(q, next)
          if (text.charCodeAt(next + 1) === QUOTE) { value += '"'; q = next + 2; continue }
          countLines(text, s, next)
          q = next + 1
          closed = true
          break
        }
        if (!closed) {
          issues.push({ kind: 'syntax', line: qLine, column: qCol, message: `line ${qLine}, column ${qCol}: the quote opened here is never closed, so the rest of the file cannot be read` })
          row.fields.push(makeField(value, qLine, qCol))
          records.push(row)
          return { records, leadingComments, issues }
        }
        row.fields.push(makeField(value, qLine, qCol))
        pos = q
        while (pos < n && isPad(text.charCodeAt(pos))) pos++
        const after = text.charCodeAt(pos)
        if (pos < n && after !== d && after !== LF && after !== CR) {
          const col = pos - lineStart + 1
          issues.push({ kind: 'syntax', line, column: col, message: `line ${line}, column ${col}: text follows a closing quote; put the whole field in quotes or none of it` })
          while (pos < n) {
            const k = text.charCodeAt(pos)
            if (k === d || k === LF || k === CR) break
            pos++
          }
        }
      } else {
        let e = s
        while (e < n) {
          const k = text.charCodeAt(e)
          if (k === d || k === LF || k === CR) break
          e++
        }
        let t = e
        while (t > s && isPad(text.charCodeAt(t - 1))) t--
        row.fields.push(makeField(text.slice(s, t), line, s - lineStart + 1))
        pos = e
      }
      if (pos < n && text.charCodeAt(pos) === d) { pos++; continue }
      break
    }
    records.push(row)
    if (pos < n) endLine()
  }
  return { records, leadingComments, issues }

  /** Line ends inside a quoted field move the line counter. */
  function countLines(t: string, from: number, to: number): void {
    for (let i = from; i < to; i++) {
      const c = t.charCodeAt(i)
      if (c === CR || c === LF) {
        if (c === CR && t.charCodeAt(i + 1) === LF) i++
        line++
        lineStart = i + 1
      }
    }
  }
}
