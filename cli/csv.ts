/**
 * Minimal CSV (RFC 4180 style): comma separated, optional double quotes with
 * "" as an escaped quote, CRLF or LF line ends. Blank lines are skipped.
 */
import { UsageError } from './usage'

export interface CsvRow { line: number; fields: string[] }

export function parseCsv(text: string): CsvRow[] {
  const rows: CsvRow[] = []
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/)
  lines.forEach((raw, i) => {
    if (raw.trim() === '') return
    rows.push({ line: i + 1, fields: splitLine(raw, i + 1) })
  })
  return rows
}

function splitLine(s: string, line: number): string[] {
  const out: string[] = []
  let i = 0
  for (;;) {
    let field = ''
    if (s[i] === '"') {
      i++
      for (;;) {
        if (i >= s.length) throw new UsageError(`line ${line}: unterminated quoted field`)
        if (s[i] === '"') {
          if (s[i + 1] === '"') { field += '"'; i += 2; continue }
          i++
          break
        }
        field += s[i++]
      }
      if (i < s.length && s[i] !== ',') throw new UsageError(`line ${line}: text after a closing quote`)
    } else {
      const j = s.indexOf(',', i)
      field = s.slice(i, j < 0 ? s.length : j)
      i = j < 0 ? s.length : j
    }
    out.push(field.trim())
    if (i >= s.length) return out
    i++ // skip comma
  }
}

export function csvField(v: string): string {
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v
}
