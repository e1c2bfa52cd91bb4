/**
 * Format and delimiter detection from a sample of the text.
 *
 * - JSON when the first non-blank character is `[` or `{`.
 * - Otherwise each candidate delimiter (tab, comma, semicolon, pipe) is
 *   counted, outside double quotes, on up to 200 non-blank, non-comment
 *   records (comment lines before them, however many, are skipped). A
 *   candidate fits when it occurs in at least 90% of them and at least half
 *   share the same count (bad rows must not hide the format). The
 *   largest such share wins; ties go in the order listed. Nothing fits:
 *   whitespace columns.
 */
import type { ParseOptions, TableFormat } from './types'

export interface Detected {
  format: TableFormat
  /** ',' ';' '|' '\t' for csv/tsv; null for whitespace and json. */
  delimiter: string | null
}

const CANDIDATES = ['\t', ',', ';', '|'] as const
const SAMPLE_LINES = 200
const SAMPLE_CHARS = 256 * 1024

export function detectFormat(text: string, options: ParseOptions): Detected {
  if (options.delimiter !== undefined) {
    return { format: options.format === 'tsv' || options.delimiter === '\t' ? 'tsv' : 'csv', delimiter: options.delimiter }
  }
  if (options.format === 'tsv') return { format: 'tsv', delimiter: '\t' }
  if (options.format === 'json') return { format: 'json', delimiter: null }
  if (options.format === 'whitespace') return { format: 'whitespace', delimiter: null }
  if (options.format === undefined && /^\s*[[{]/.test(text.slice(0, 1024))) return { format: 'json', delimiter: null }
  const lines = sampleLines(text)
  let best: { delimiter: string; share: number } | null = null
  for (const delim of CANDIDATES) {
    if (options.format === 'csv' && delim === '\t') continue
    const share = fitShare(lines, delim)
    if (share >= 0.5 && presence(lines, delim) >= 0.9 && (best === null || share > best.share)) best = { delimiter: delim, share }
  }
  if (options.format === 'csv') return { format: 'csv', delimiter: best?.delimiter ?? ',' }
  if (best === null) return { format: 'whitespace', delimiter: null }
  return { format: best.delimiter === '\t' ? 'tsv' : 'csv', delimiter: best.delimiter }
}

const COMMENT = /^(?:[#!%]|\/\/)/

/**
 * Records of the sample, split at line ends outside double quotes: up to
 * SAMPLE_LINES non-blank, non-comment records or SAMPLE_CHARS of them. Comment
 * lines are skipped without counting, so a long log header before the table
 * (a solver's run log, say) does not leave the sample without a data row.
 */
function sampleLines(text: string): string[] {
  const out: string[] = []
  let kept = 0
  let quoted = false
  let start = 0
  const push = (end: number): void => {
    const rec = text.slice(start, end)
    const t = rec.trim()
    if (t !== '' && !COMMENT.test(t)) {
      out.push(rec)
      kept += rec.length
    }
  }
  let i = 0
  for (; i < text.length && out.length < SAMPLE_LINES && kept < SAMPLE_CHARS; i++) {
    const c = text.charCodeAt(i)
    if (c === 34) quoted = !quoted
    else if ((c === 10 || c === 13) && !quoted) { push(i); start = i + 1 }
  }
  if (i === text.length && start < text.length && out.length < SAMPLE_LINES) push(text.length)
  // An unbalanced quote would hide every later line end; judge by lines then.
  if (quoted) {
    return text.slice(0, SAMPLE_CHARS).split(/\r\n|\r|\n/).filter(l => l.trim() !== '' && !COMMENT.test(l.trim())).slice(0, SAMPLE_LINES).map(l => l.replace(/"/g, ''))
  }
  return out
}

/** Share of lines whose delimiter count equals the most common non-zero count. */
function fitShare(lines: string[], delim: string): number {
  if (lines.length === 0) return 0
  const tally = new Map<number, number>()
  for (const line of lines) {
    const k = countOutsideQuotes(line, delim)
    if (k > 0) tally.set(k, (tally.get(k) ?? 0) + 1)
  }
  let top = 0
  for (const v of tally.values()) top = Math.max(top, v)
  return top / lines.length
}

function presence(lines: string[], delim: string): number {
  let k = 0
  for (const line of lines) if (countOutsideQuotes(line, delim) > 0) k++
  return lines.length === 0 ? 0 : k / lines.length
}

function countOutsideQuotes(line: string, delim: string): number {
  let count = 0
  let quoted = false
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]
    if (ch === '"') quoted = !quoted
    else if (ch === delim && !quoted) count++
  }
  return count
}
