import { describe, expect, it } from 'vitest'
import { csvCell } from '../../../server/utils/csv'

// RFC 4180 quoting; formula-injection guard as advised by OWASP ("CSV Injection"), common practice.
describe('csvCell', () => {
  it.each([
    ['plain', 'plain'],
    ['-1.5e3', '-1.5e3'],
    ['+2.0D-05', '+2.0D-05'],
    ['-inf', '-inf'],
    ['=1+2', '\'=1+2'],
    ['@SUM(A1)', '\'@SUM(A1)'],
    ['+cmd|x', '\'+cmd|x'],
    ['-2+3', '\'-2+3'],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['=a,b', '"\'=a,b"'],
  ])('%s → %s', (input, output) => {
    expect(csvCell(input)).toBe(output)
  })
  it('writes null and numbers plainly', () => {
    expect(csvCell(null)).toBe('')
    expect(csvCell(42)).toBe('42')
  })
})
