/**
 * Canonical input keys: equal exact values give equal text, whatever the
 * spelling, and different values never collide.
 */
import { describe, expect, it } from 'vitest'
import { canonicalDecimal, canonicalValue, inputKey } from '../../../shared/grid/keys'
import { parseExactDecimal } from '../../../shared/numeric/exact'

describe('canonicalValue', () => {
  it.each([
    ['0.5', '0.5'], ['0.50', '0.5'], ['5e-1', '0.5'], ['+.5', '0.5'], ['50E-2', '0.5'],
    ['-0', '0'], ['0.000', '0'], ['0e7', '0'],
    ['12', '12'], ['12.000', '12'], ['1.2e1', '12'], ['-3.25', '-3.25'],
    ['1e24', '1000000000000000000000000'], ['1e25', '1e25'], ['1.5e30', '15e29'],
    ['1e-25', '0.0000000000000000000000001'], ['1e-30', '1e-30'], ['-2.5e-40', '-25e-41'],
    ['0.1000000000000000055511151231257827', '0.1000000000000000055511151231257827'],
  ])('%s → %s', (text, canonical) => {
    expect(canonicalValue(text)).toBe(canonical)
  })

  it('gives text that is already canonical back unchanged, and the same as the full path for near misses', () => {
    // the short-cut for canonical text must agree with parsing and re-printing
    const full = (t: string) => canonicalDecimal(parseExactDecimal(t))
    const texts = ['0', '-0', '7', '-7', '10', '100', '0.5', '-0.25', '0.001', '12.5', '012', '1.0', '-0.0', '+1',
      '100000000000000000000000', '1000000000000000000000000', '0.0000000000000000000001', '0.00000000000000000000001',
      '12345678901234567890123.5', '1.', '.5', '-.5']
    for (let k = 0; k < 400; k++) {
      const i = Math.floor(Math.random() * 2000) - 1000
      texts.push(String(i / 100), String(i), (i / 7).toString(), (i * 1e-9).toString())
    }
    for (const t of texts) expect(canonicalValue(t), t).toBe(full(t))
  })

  it('refuses text that is not a decimal', () => {
    expect(() => canonicalValue('0x1p3')).toThrow(/not a decimal/)
  })
})

describe('inputKey', () => {
  it('sorts names and canonicalises values', () => {
    expect(inputKey({ x: '0.50', n: '12.0' })).toBe('n=12;x=0.5')
    expect(inputKey({ n: '12', x: '5e-1' })).toBe(inputKey({ x: '0.5', n: '1.2e1' }))
  })

  it.each([
    [{ n: '3', x: '0.1' }, { n: '3', x: '0.10000000000000001' }],
    [{ n: '3', x: '1' }, { n: '3', x: '-1' }],
    [{ n: '3', x: '1' }, { n: '4', x: '1' }],
  ])('different values differ: %j vs %j', (a, b) => {
    expect(inputKey(a)).not.toBe(inputKey(b))
  })

  it('fills catalogue defaults and keeps choices as text when given the function', () => {
    expect(inputKey({ n: '5', i: '2' }, 'gauss-hermite')).toBe('i=2;n=5;weight=physicists')
    expect(inputKey({ n: '5', i: '2', weight: 'physicists' }, 'gauss-hermite')).toBe(inputKey({ i: '2.0', n: '5' }, 'gauss-hermite'))
    expect(inputKey({ n: '5', i: '2', weight: 'probabilists' }, 'gauss-hermite')).not.toBe(inputKey({ n: '5', i: '2' }, 'gauss-hermite'))
  })

  it('percent-encodes text so it cannot forge a separator', () => {
    expect(inputKey({ x: 'a;b=c' })).toBe('x=a%3Bb%3Dc')
  })
})
