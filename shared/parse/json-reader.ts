/**
 * A tolerant JSON reader that keeps each value's source text and position.
 *
 * It follows RFC 8259 with two liberties needed for solver output:
 * - numbers are kept as their source text (never converted to a JS number),
 *   and any bare token is read by `parseNumber`, so `NaN`, `Infinity`,
 *   `-Infinity` (as Python's json module writes them by default) and also
 *   `nan`, `inf`, `1.5D+03` are accepted where a number may stand;
 * - raw line ends inside strings are tolerated.
 * `true`, `false` and `null` are the usual literals.
 */
import type { ParseIssue } from './types'

export type JValue =
  | { t: 'arr'; items: JValue[]; line: number; column: number }
  | { t: 'obj'; keys: string[]; vals: JValue[]; line: number; column: number }
  | { t: 'str'; s: string; line: number; column: number }
  | { t: 'tok'; s: string; line: number; column: number }

export class JsonSyntaxError extends Error {
  constructor(readonly issue: ParseIssue) {
    super(issue.message)
  }
}

const LF = 10, CR = 13, SPACE = 32, TAB = 9

/** Parse the whole text; throws JsonSyntaxError with a position on bad syntax. */
export function readJson(text: string): JValue {
  let pos = 0
  let line = 1
  let lineStart = 0
  const n = text.length

  const fail = (message: string, at = pos): never => {
    const column = at - lineStart + 1
    throw new JsonSyntaxError({ kind: 'syntax', line, column, message: `line ${line}, column ${column}: ${message}` })
  }
  const skip = (): void => {
    while (pos < n) {
      const c = text.charCodeAt(pos)
      if (c === SPACE || c === TAB) pos++
      else if (c === LF || c === CR) {
        pos += c === CR && text.charCodeAt(pos + 1) === LF ? 2 : 1
        line++
        lineStart = pos
      } else break
    }
  }

  function str(): string {
    const start = pos + 1
    let i = start
    let escaped = false
    for (;;) {
      if (i >= n) fail('a string starts here but never ends')
      const c = text.charCodeAt(i)
      if (c === 34) break
      if (c === 92) { escaped = true; i += 2; continue }
      if (c === LF || c === CR) { line++; lineStart = i + 1 }
      i++
    }
    const body = text.slice(start, i)
    pos = i + 1
    if (!escaped) return body
    try {
      return JSON.parse(`"${body.replace(/[\r\n]/g, (m) => (m === '\n' ? '\\n' : '\\r'))}"`) as string
    } catch {
      return fail('this string holds an escape that JSON does not allow', start - 1)
    }
  }

  let depth = 0
  function value(): JValue {
    if (++depth > 32) fail('the JSON is nested too deeply to be a table')
    try {
      return inner()
    } finally {
      depth--
    }
  }

  function inner(): JValue {
    skip()
    if (pos >= n) fail('the file ends where a value was expected')
    const vLine = line, column = pos - lineStart + 1
    const c = text[pos]
    if (c === '[') {
      pos++
      const items: JValue[] = []
      skip()
      if (text[pos] === ']') { pos++; return { t: 'arr', items, line: vLine, column } }
      for (;;) {
        items.push(value())
        skip()
        if (text[pos] === ',') { pos++; continue }
        if (text[pos] === ']') { pos++; return { t: 'arr', items, line: vLine, column } }
        fail(pos >= n ? 'the file ends before this array is closed; is it cut short?' : 'expected "," or "]" here')
      }
    }
    if (c === '{') {
      pos++
      const keys: string[] = []
      const vals: JValue[] = []
      skip()
      if (text[pos] === '}') { pos++; return { t: 'obj', keys, vals, line: vLine, column } }
      for (;;) {
        skip()
        if (text[pos] !== '"') fail('expected a quoted key here')
        keys.push(str())
        skip()
        if (text[pos] !== ':') fail('expected ":" after the key')
        pos++
        vals.push(value())
        skip()
        if (text[pos] === ',') { pos++; continue }
        if (text[pos] === '}') { pos++; return { t: 'obj', keys, vals, line: vLine, column } }
        fail(pos >= n ? 'the file ends before this object is closed; is it cut short?' : 'expected "," or "}" here')
      }
    }
    if (c === '"') return { t: 'str', s: str(), line: vLine, column }
    const start = pos
    while (pos < n) {
      const k = text.charCodeAt(pos)
      // , ] } : " and blanks end a bare token
      if (k === 44 || k === 93 || k === 125 || k === 58 || k === 34 || k <= SPACE) break
      pos++
    }
    if (pos === start) fail(`unexpected "${c}"`)
    return { t: 'tok', s: text.slice(start, pos), line: vLine, column }
  }

  const root = value()
  skip()
  if (pos < n) fail('more text follows the end of the JSON value')
  return root
}
