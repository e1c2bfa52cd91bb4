/**
 * κ = |x f′(x)/f(x)| as reported with each value, against mpmath on fresh
 * random cases: f′ there comes from mpmath.diff (numerical differentiation
 * at 40 digits), independent of the engine's derivative identities.
 */
import { describe, it, expect, beforeAll } from 'vitest'
import { evaluate } from '../../../shared/reference/index'
import { mpmath, randomSource, randomDecimal, relDiff, type MpCase } from './support'

describe('condition numbers against mpmath.diff', () => {
  const { next } = randomSource('condition')
  const cases: MpCase[] = []
  const add = (id: string, params: Record<string, string>) => cases.push({ id, params, digits: 20, kappa: true })
  for (let i = 0; i < 8; i++) add('hermite', { n: String(1 + Math.floor(next() * 60)), x: randomDecimal(next, -9, 9, 4) })
  for (let i = 0; i < 5; i++) add('hermite-prob', { n: String(1 + Math.floor(next() * 60)), x: randomDecimal(next, -12, 12, 4) })
  for (let i = 0; i < 5; i++) add('hermite-function', { n: String(1 + Math.floor(next() * 60)), x: randomDecimal(next, -12, 12, 4) })
  for (let i = 0; i < 4; i++) add('hermite-derivative', { n: String(3 + Math.floor(next() * 30)), k: String(1 + Math.floor(next() * 3)), x: randomDecimal(next, -5, 5, 3) })
  for (let i = 0; i < 8; i++) add('kummer', { a: randomDecimal(next, -6, 6, 3), b: randomDecimal(next, 0.2, 8, 3), z: randomDecimal(next, -30, 30, 3) })
  for (let i = 0; i < 4; i++) add('parabolic-cylinder', { nu: randomDecimal(next, -4, 4, 2), z: randomDecimal(next, -5, 6, 2) })
  let ref: Array<string | string[]> = []
  beforeAll(() => { ref = mpmath(cases) })
  it.each(cases.map((c, i) => [c.id, JSON.stringify(c.params), i] as const))('κ for %s %s', (id, _p, i) => {
    const out = evaluate(id, cases[i]!.params, 20).outputs[0]!
    expect(out.kappa).not.toBeNull()
    // κ is given to 4 significant digits.
    expect(relDiff(out.kappa!, ref[i] as string).lt('1e-3')).toBe(true)
  })
  it('κ is null where f = 0 (an exact zero), and 0 for constants', () => {
    expect(evaluate('hermite', { n: '5', x: '0' }, 20).outputs[0]!.kappa).toBeNull()
    expect(evaluate('hermite', { n: '0', x: '3' }, 20).outputs[0]!.kappa).toBe('0')
  })
})
