/**
 * The engine against committed mpmath fixtures (source: Debian
 * python3-mpmath, written by scripts/reference/make_fixtures.py; each
 * fixture file names its mpmath version). Every case must certify the
 * fixture's digits and agree with mpmath to all of them.
 */
import { describe, it } from 'vitest'
import { evaluate } from '../../../shared/reference/index'
import { loadFixture, expectAgrees } from './support'

const IDS = ['hermite', 'hermite-prob', 'hermite-function', 'hermite-derivative', 'hermite-series', 'kummer', 'parabolic-cylinder', 'gauss-hermite'] as const

describe.each(IDS)('%s against mpmath fixtures', (id) => {
  const fx = loadFixture(id)
  const rows = fx.cases.map((c) => [JSON.stringify(c.params), c.params, c.expected] as const)
  it.each(rows)('%s', (_label, params, expected) => {
    const r = evaluate(id, params, fx.digits)
    const exp = Array.isArray(expected) ? expected : [expected]
    exp.forEach((e, i) => expectAgrees(r.outputs[i]!, e, fx.digits, `${id} ${JSON.stringify(params)} output ${i}`))
  })
})
