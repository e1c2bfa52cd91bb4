/**
 * Bytes as uploaded → text.
 *
 * - A byte-order mark decides: EF BB BF is UTF-8, FF FE is UTF-16LE, FE FF
 *   is UTF-16BE (Unicode §23.8 / RFC 3629 §6). The mark is removed.
 * - With no mark: UTF-16 is recognised by NUL bytes in every other position
 *   of the first bytes (ASCII text in UTF-16 looks like that; common
 *   practice), otherwise strict UTF-8 is tried, and if the bytes are not
 *   valid UTF-8 they are read as Windows-1252, the usual single-byte code
 *   page of spreadsheet exports (common practice).
 */
import type { TextEncoding } from './types'

export interface DecodedText {
  text: string
  encoding: TextEncoding
  bom: boolean
  /** Set when the bytes contradict their byte-order mark. */
  problem?: string
}

export function decodeTable(bytes: Uint8Array): DecodedText {
  const b0 = bytes[0], b1 = bytes[1], b2 = bytes[2]
  if (b0 === 0xef && b1 === 0xbb && b2 === 0xbf) {
    const text = utf8(bytes.subarray(3), true)
    if (text !== null) return { text, encoding: 'utf-8', bom: true }
    return {
      text: utf8(bytes.subarray(3), false) ?? '',
      encoding: 'utf-8',
      bom: true,
      problem: 'the file starts with a UTF-8 byte-order mark but holds bytes that are not UTF-8; save it as UTF-8 again',
    }
  }
  if (b0 === 0xff && b1 === 0xfe) return { text: utf16(bytes.subarray(2), 'utf-16le'), encoding: 'utf-16le', bom: true }
  if (b0 === 0xfe && b1 === 0xff) return { text: utf16(bytes.subarray(2), 'utf-16be'), encoding: 'utf-16be', bom: true }
  const guess = sniffUtf16(bytes)
  if (guess) return { text: utf16(bytes, guess), encoding: guess, bom: false }
  const text = utf8(bytes, true)
  if (text !== null) return { text, encoding: 'utf-8', bom: false }
  return { text: new TextDecoder('windows-1252').decode(bytes), encoding: 'windows-1252', bom: false }
}

/** Strict decoding returns null on invalid bytes; lenient replaces them with U+FFFD. */
function utf8(bytes: Uint8Array, strict: boolean): string | null {
  try {
    return new TextDecoder('utf-8', { fatal: strict, ignoreBOM: true }).decode(bytes)
  } catch {
    return null
  }
}

function utf16(bytes: Uint8Array, enc: 'utf-16le' | 'utf-16be'): string {
  return new TextDecoder(enc, { ignoreBOM: true }).decode(bytes)
}

function sniffUtf16(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  const n = Math.min(bytes.length, 64) & ~1
  if (n < 4) return null
  let evenNul = 0, oddNul = 0
  for (let i = 0; i < n; i += 2) {
    if (bytes[i] === 0) evenNul++
    if (bytes[i + 1] === 0) oddNul++
  }
  const pairs = n / 2
  if (oddNul === pairs && evenNul === 0) return 'utf-16le'
  if (evenNul === pairs && oddNul === 0) return 'utf-16be'
  return null
}
