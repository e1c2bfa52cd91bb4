/**
 * One field's text → its kind and exact value. Never goes through a JS
 * number: the digits are rewritten as a canonical exact decimal string
 * (see canonical.ts), so `0.1` stays one tenth and 1.0e-400 is not zero.
 *
 * Accepted spellings (surrounding blanks ignored, letters in any case):
 * - decimals: `12`, `-0.5`, `.5`, `5.`, `+1.5e-3`, `1E+05`;
 * - Fortran exponents `D` and `Q` in place of `E`: `1.5D+03`, `2.0Q-5`
 *   (common practice: Fortran D/Q editing and REAL*16 output);
 * - exponents that lost their letter: `1.234-305`, `-2.5+100`. Fortran Ew.d
 *   editing drops the letter when the exponent needs three digits (Fortran
 *   2008 §10.7.2.3.2, Table 10.1). A decimal point is required, as E/D
 *   editing always writes one; so `12-3` stays text (it might be a date);
 * - C99 hex floats, `0x1.8p+1`, `-0X1.FFFFFFFFFFFFFP+1023` (hex-float.ts);
 * - infinities: `inf`, `infinity`, with `+`/`-`, and MSVC's `1.#INF`,
 *   `-1.#INF00` (ISO C §7.19.6.1 for inf/infinity; MSVC's forms are common
 *   practice of its older runtimes);
 * - NaNs: `nan`, `-nan`, `nan(0x8000)`, `nan(ind)`, `-nan(ind)`, `nan(snan)`,
 *   `1.#QNAN`, `1.#SNAN`, `1.#IND`, `NaNQ`, `NaNS` (ISO C §7.19.6.1 allows
 *   `nan(chars)`; the rest are common practice). IEEE 754 §6.3 leaves a NaN's
 *   sign unspecified in meaning; we keep it as written anyway;
 * - a field of asterisks, `********`: an overflowed Fortran field (Fortran
 *   2008 §10.7.2.1: a value that does not fit is written as asterisks).
 *
 * Not accepted (text, with a hint): decimal commas, digit group separators,
 * and fields that ran into each other.
 */
import { scanDecimal } from './decimal-scan'
import { readHexFloat } from './hex-float'
import type { NumberReading } from './types'

const INF_RE = /^([+-]?)(?:inf|infinity|1\.#inf0*)$/i
const NAN_RE = /^([+-]?)(?:nan(?:\([0-9a-z_]*\))?|nan[qs]|1\.#(?:qnan|snan|ind)0*)$/i
const STARS_RE = /^\*+$/

export function parseNumber(raw: string): NumberReading {
  const out: NumberReading = { kind: 'empty', value: undefined, sign: undefined, problem: undefined }
  readInto(out, raw)
  if (out.kind === 'empty' || out.kind === 'overflowed') return { kind: out.kind }
  if (out.kind === 'text') return out.problem === undefined ? { kind: 'text' } : { kind: 'text', problem: out.problem }
  return out.kind === 'number' ? { kind: 'number', value: out.value, sign: out.sign } : { kind: out.kind, sign: out.sign }
}

const isBlank = (c: number): boolean => c === 32 || c === 9 || c === 160 || c === 0xfeff

/** Sets kind, value, sign and problem of `out` from `raw` (internal; keeps one object per field). */
export function readInto(out: NumberReading, raw: string): void {
  let s = raw
  if (s.length > 0 && (isBlank(s.charCodeAt(0)) || isBlank(s.charCodeAt(s.length - 1)))) s = s.trim()
  if (s === '') { out.kind = 'empty'; return }
  const c = s.charCodeAt(0)
  const dec = scanDecimal(s)
  if (dec !== null) {
    out.kind = 'number'
    out.value = dec
    out.sign = c === 45 ? -1 : 1
    return
  }
  if (c === 42 && STARS_RE.test(s)) { out.kind = 'overflowed'; return }
  const hex = readHexFloat(s)
  if (hex) {
    if (!hex.ok) { out.kind = 'text'; out.problem = hex.problem; return }
    out.kind = 'number'
    out.value = hex.value
    out.sign = hex.neg ? -1 : 1
    return
  }
  const inf = INF_RE.exec(s)
  if (inf) { out.kind = 'inf'; out.sign = inf[1] === '-' ? -1 : 1; return }
  const nan = NAN_RE.exec(s)
  if (nan) { out.kind = 'nan'; out.sign = nan[1] === '-' ? -1 : 1; return }
  out.kind = 'text'
  out.problem = hintFor(s)
}

/** A hint for text that looks like a number someone meant to write. */
function hintFor(s: string): string | undefined {
  if (!/^[+-]?[\d.]/.test(s)) return undefined
  if (/^[+-]?\d+,\d+$/.test(s)) return 'decimal commas are not read; write a point'
  if (/^[+-]?\d{1,3}(?:,\d{3})+(?:\.\d*)?$/.test(s)) return 'digit group separators are not read'
  if (/\d\*|\*\d/.test(s)) return 'it looks like fields that ran together (fixed-width output with no space between fields)'
  if (/^[+-]?\d+[+-]\d+$/.test(s)) return 'an exponent without its letter needs a decimal point in the mantissa'
  return undefined
}

export const isNumericKind = (k: NumberReading['kind']): boolean =>
  k === 'number' || k === 'inf' || k === 'nan' || k === 'overflowed'
