/**
 * Encodings and byte-order marks (Unicode §23.8; RFC 3629 §6 for the UTF-8 BOM).
 */
import { describe, it, expect } from 'vitest'
import { parseTable } from '../../../shared/parse/index'
import { raws, utf16, utf8 } from './support'

const TEXT = '# µ-scaled x\r\nn,x,H\r\n0,0.5,1\r\n5,0.5,41\r\n'
const ROWS = [['0', '0.5', '1'], ['5', '0.5', '41']]

describe('encodings', () => {
  it.each([
    ['UTF-8', utf8(TEXT), 'utf-8', false],
    ['UTF-8 with BOM', new Uint8Array([0xef, 0xbb, 0xbf, ...utf8(TEXT)]), 'utf-8', true],
    ['UTF-16LE with BOM', utf16(TEXT, 'le'), 'utf-16le', true],
    ['UTF-16BE with BOM', utf16(TEXT, 'be'), 'utf-16be', true],
    ['UTF-16LE without BOM', utf16(TEXT, 'le', false), 'utf-16le', false],
    ['UTF-16BE without BOM', utf16(TEXT, 'be', false), 'utf-16be', false],
  ] as const)('%s', (_, bytes, encoding, bom) => {
    const t = parseTable(bytes)
    expect([t.encoding, t.bom]).toEqual([encoding, bom])
    expect(t.columns).toEqual(['n', 'x', 'H'])
    expect(raws(t)).toEqual(ROWS)
    expect(t.errors).toEqual([])
  })

  it('reads bytes that are not UTF-8 as Windows-1252', () => {
    const bytes = new Uint8Array([...utf8('n,x\xb5\n'), 0x0a, ...utf8('1,2\n')].map((b) => b))
    bytes.set([0x6e, 0x2c, 0x78, 0xb5, 0x0a], 0) // "n,xµ" with µ as the single byte B5
    const t = parseTable(bytes.subarray(0, 5 + 4))
    expect(t.encoding).toBe('windows-1252')
    expect(t.columns).toEqual(['n', 'xµ'])
  })

  it('reports bytes that contradict a UTF-8 BOM', () => {
    const t = parseTable(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8('n,x\n1,'), 0xff, ...utf8('\n')]))
    expect(t.errors[0]).toMatchObject({ kind: 'encoding', line: 0 })
  })

  it('keeps the BOM out of the first column name', () => {
    const t = parseTable(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8('n\tH\n1\t2\n')]))
    expect(t.columns[0]).toBe('n')
    expect(t.rows[0]!.fields[0]!.column).toBe(1)
  })
})
