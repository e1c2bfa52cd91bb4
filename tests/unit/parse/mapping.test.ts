/**
 * suggestColumnMapping: the first guess shown in the submit preview.
 */
import { describe, it, expect } from 'vitest'
import { suggestColumnMapping } from '../../../shared/parse/index'

describe('suggestColumnMapping', () => {
  it.each([
    [['n', 'x', 'H'], ['n', 'x'], { n: 'n', x: 'x', value: 'H' }, { n: 'name', x: 'name', value: 'synonym' }],
    [['N', 'X', 'value'], ['n', 'x'], { n: 'N', x: 'X', value: 'value' }, { n: 'name', x: 'name', value: 'name' }],
    [['x', 'n', 'H_n(x)'], ['n', 'x'], { n: 'n', x: 'x', value: 'H_n(x)' }, { n: 'name', x: 'name', value: 'synonym' }],
    [['order', 'arg', 'result'], ['n', 'x'], { n: 'order', x: 'arg', value: 'result' }, { n: 'synonym', x: 'synonym', value: 'synonym' }],
    [['col1', 'col2', 'col3'], ['n', 'x'], { n: 'col1', x: 'col2', value: 'col3' }, { n: 'position', x: 'position', value: 'position' }],
    [['x', 'err', 'y', 'n'], ['n', 'x'], { n: 'n', x: 'x', value: 'y' }, { n: 'name', x: 'name', value: 'synonym' }],
    [['a', 'b', 'z', 'M(a,b,z)'], ['a', 'b', 'z'], { a: 'a', b: 'b', z: 'z', value: 'M(a,b,z)' }, { a: 'name', b: 'name', z: 'name', value: 'synonym' }],
    [['n', 'x'], ['n', 'x'], { n: 'n', x: 'x', value: undefined }, { n: 'name', x: 'name', value: 'none' }],
    [['case', 'n', 'x', 'psi'], ['n', 'x'], { n: 'n', x: 'x', value: 'psi' }, { n: 'name', x: 'name', value: 'synonym' }],
  ])('%j with %j', (columns, params, mapping, how) => {
    const got = suggestColumnMapping(columns, params)
    expect(got.mapping).toEqual(mapping)
    expect(got.how).toEqual(how)
  })

  it('never maps one column twice', () => {
    const got = suggestColumnMapping(['x', 'x_2'], ['x', 'z'])
    expect(got.mapping).toEqual({ x: 'x', z: 'x_2', value: undefined })
  })
})
