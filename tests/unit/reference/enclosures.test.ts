/**
 * The error bounds themselves: at a deliberately low working precision the
 * enclosures [M − R, M + R]·2^−F of the fixed-point cores must still contain
 * mpmath's value (Debian python3-mpmath, live, fresh random cases). At the
 * usual precisions the bound is never tested this hard, so this is where a
 * bound that undershoots would show.
 */
import { describe, it, expect, beforeAll } from 'vitest'
import { runRecurrence } from '../../../shared/reference/recurrence'
import { kummerSeries } from '../../../shared/reference/kummer-core'
import { parseExactDecimal } from '../../../shared/numeric/exact'
import { ceilPow2 } from '../../../shared/numeric/bits'
import { mpmath, randomSource, randomDecimal, TestDecimal as D, type MpCase } from './support'

const F = 40

function contains(M: bigint, log2R: number, Fb: number, ref: string): boolean {
  const R = ceilPow2(log2R)
  const scale = new D(2).pow(Fb)
  const lo = new D((M - R).toString()).div(scale)
  const hi = new D((M + R).toString()).div(scale)
  const v = new D(ref)
  return lo.lte(v) && v.lte(hi)
}

describe('enclosures at 40 working bits contain the mpmath value', () => {
  const { next } = randomSource('enclosures')
  const poly: MpCase[] = []
  for (let i = 0; i < 30; i++) {
    poly.push({ id: next() < 0.5 ? 'hermite' : 'hermite-prob', params: { n: String(Math.floor(next() * 120)), x: randomDecimal(next, -12, 12, 7) }, digits: 30 })
  }
  const kum: MpCase[] = []
  for (let i = 0; i < 30; i++) {
    kum.push({ id: 'kummer', params: { a: randomDecimal(next, -8, 8, 3), b: randomDecimal(next, 0.3, 8, 3), z: randomDecimal(next, -25, 25, 3) }, digits: 30 })
  }
  let refP: Array<string | string[]> = []
  let refK: Array<string | string[]> = []
  beforeAll(() => {
    const all = mpmath([...poly, ...kum])
    refP = all.slice(0, poly.length)
    refK = all.slice(poly.length)
  })
  it.each(poly.map((c, i) => [c.id, JSON.stringify(c.params), i] as const))('%s %s', (id, _p, i) => {
    const c = poly[i]!
    const n = Number(c.params.n)
    const run = runRecurrence(id === 'hermite' ? 'H' : 'He', parseExactDecimal(c.params.x!), Math.max(n, 1), F)
    expect(contains(run.M[n]!, run.log2R[n]!, F, refP[i] as string)).toBe(true)
  })
  it.each(kum.map((c, i) => [JSON.stringify(c.params), i] as const))('kummer series %s', (_p, i) => {
    const c = kum[i]!.params
    const run = kummerSeries(parseExactDecimal(c.a!), parseExactDecimal(c.b!), parseExactDecimal(c.z!), F)
    expect(contains(run.S, run.log2R, F, refK[i] as string)).toBe(true)
  })
})
