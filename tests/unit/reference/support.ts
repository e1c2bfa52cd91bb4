/**
 * Test support for the reference engine: the live bridge to Debian's mpmath
 * (one /usr/bin/python3 process per batch), fixture loading, a seeded
 * random source and the digit-exact comparison.
 */
import { spawnSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import Decimal from 'decimal.js'
import { expect } from 'vitest'

const ROOT = resolve(__dirname, '../../..')
export const PYTHON = '/usr/bin/python3'

export interface MpCase { id: string; params: Record<string, string>; digits: number; kappa?: boolean }

/** Values from mpmath for a batch of cases (see scripts/reference/mp_reference.py). */
export function mpmath(cases: MpCase[]): Array<string | string[]> {
  const r = spawnSync(PYTHON, [resolve(ROOT, 'scripts/reference/mp_reference.py')], {
    input: JSON.stringify(cases), encoding: 'utf8', maxBuffer: 64 << 20,
  })
  if (r.status !== 0) throw new Error(`mpmath bridge failed: ${r.stderr || r.error?.message}`)
  return JSON.parse(r.stdout) as Array<string | string[]>
}

export interface Fixture { source: string; digits: number; cases: Array<{ params: Record<string, string>; expected: string | string[] }> }

export function loadFixture(id: string): Fixture {
  return JSON.parse(readFileSync(resolve(ROOT, 'fixtures/reference', `${id}.json`), 'utf8')) as Fixture
}

/** A seeded generator; the seed changes every run unless PLUMBLINE_SEED is set. */
export function randomSource(label: string): { seed: number; next: () => number } {
  const seed = process.env.PLUMBLINE_SEED ? Number(process.env.PLUMBLINE_SEED) : (Date.now() ^ (label.length * 2654435761)) >>> 0
  let s = seed || 1
  console.info(`[${label}] random seed ${seed} (set PLUMBLINE_SEED to repeat)`)
  return {
    seed,
    next: () => { // xorshift32
      s ^= s << 13; s >>>= 0; s ^= s >>> 17; s ^= s << 5; s >>>= 0
      return s / 4294967296
    },
  }
}

/** A decimal string uniform in [lo, hi] with the given decimal places. */
export function randomDecimal(next: () => number, lo: number, hi: number, places: number): string {
  const span = BigInt(Math.round((hi - lo) * 10 ** places))
  const k = BigInt(Math.floor(next() * Number(span)))
  const v = BigInt(Math.round(lo * 10 ** places)) + k
  return new Decimal(v.toString()).div(new Decimal(10).pow(places)).toFixed(places)
}

const D = Decimal.clone({ precision: 400, rounding: Decimal.ROUND_HALF_UP, minE: -9e15, maxE: 9e15 })

/**
 * The engine's value, correctly rounded to its certified digits, must equal
 * the reference rounded to the same digits, and at least `minDigits` digits
 * must be certified. The reference carries 15 digits more than asked.
 */
export function expectAgrees(got: { value: string; digits: number }, expected: string, minDigits: number, where = ''): void {
  expect(got.digits, `certified digits ${where}`).toBeGreaterThanOrEqual(minDigits)
  const ref = new D(expected)
  if (got.value === '0') {
    expect(ref.abs().lt('1e-30'), `exact zero vs ${expected} ${where}`).toBe(true)
    return
  }
  const rounded = ref.toSignificantDigits(got.digits, Decimal.ROUND_HALF_UP)
  expect(new D(got.value).eq(rounded), `${got.value} vs ${expected} ${where}`).toBe(true)
}

/** Relative difference |a − b| / |b| as a Decimal. */
export function relDiff(a: string | Decimal, b: string | Decimal): Decimal {
  const x = new D(a), y = new D(b)
  return y.isZero() ? x.abs() : x.minus(y).abs().div(y.abs())
}

export { D as TestDecimal }
