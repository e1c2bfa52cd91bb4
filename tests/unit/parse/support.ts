import { parseTable } from '../../../shared/parse/index'
import type { ParseOptions, ParsedTable } from '../../../shared/parse/index'

export const utf8 = (s: string): Uint8Array => new TextEncoder().encode(s)

export function table(text: string, options?: ParseOptions): ParsedTable {
  return parseTable(utf8(text), options)
}

/** Rows as arrays of raw field text. */
export const raws = (t: ParsedTable): string[][] => t.rows.map((r) => r.fields.map((f) => f.raw))

/** Rows as arrays of canonical values, or the kind when there is no value. */
export const values = (t: ParsedTable): string[][] => t.rows.map((r) => r.fields.map((f) => f.value ?? f.kind))

export function utf16(text: string, endian: 'le' | 'be', bom = true): Uint8Array {
  const out = new Uint8Array((bom ? 2 : 0) + text.length * 2)
  let i = 0
  if (bom) { out[0] = endian === 'le' ? 0xff : 0xfe; out[1] = endian === 'le' ? 0xfe : 0xff; i = 2 }
  for (let k = 0; k < text.length; k++, i += 2) {
    const c = text.charCodeAt(k)
    out[i] = endian === 'le' ? c & 0xff : c >> 8
    out[i + 1] = endian === 'le' ? c >> 8 : c & 0xff
  }
  return out
}
