/** The `plumbline eval` command, run as a real process through tsx. */
import { describe, it, expect } from 'vitest'
import { spawnSync } from 'node:child_process'
import { resolve } from 'node:path'

const ROOT = resolve(__dirname, '../../..')
const TSX = resolve(ROOT, 'node_modules/.bin/tsx')
function run(args: string[], input = '') {
  const r = spawnSync(TSX, ['cli/plumbline.ts', ...args], { cwd: ROOT, input, encoding: 'utf8' })
  return { code: r.status, out: r.stdout, err: r.stderr }
}

describe('plumbline eval', () => {
  it('appends value and digits to each CSV row', () => {
    const r = run(['eval', 'hermite', '--digits', '20'], 'n,x\n3,0.5\n2,-1.5\n')
    expect(r.code).toBe(0)
    expect(r.out).toBe('n,x,value,digits\n3,0.5,-5.0000000000000000000e+0,20\n2,-1.5,7.0000000000000000000e+0,20\n')
  })
  it('hermite-series writes y_even and y_odd; json format and κ on request', () => {
    const r = run(['eval', 'hermite-series', '--digits', '15', '--format', 'json', '--kappa'], 'lambda,x\n2,1.5\n')
    expect(r.code).toBe(0)
    const rows = JSON.parse(r.out) as Array<Record<string, unknown>>
    expect(rows[0]).toMatchObject({ lambda: '2', x: '1.5', y_even: '-3.50000000000000e+0', digits: 15 })
    expect(typeof rows[0]!.kappa_y_even).toBe('string')
  })
  it('gauss-hermite writes i,node,weight', () => {
    const r = run(['eval', 'gauss-hermite', '--n', '3', '--digits', '16'])
    expect(r.code).toBe(0)
    expect(r.out.split('\n')[0]).toBe('i,node,weight')
    expect(r.out).toContain('2,0,1.181635900603677e+0')
  })
  it.each([
    [['eval', 'hermite'], 'n,x\n3,0.5\n4,abc\n', /line 3, field x: .*not a decimal number/],
    [['eval', 'hermite'], 'n,x\n3.5,1\n', /line 2, field n: n must be an integer/],
    [['eval', 'kummer'], 'a,b,z\n1,2,3\n1,-2,3\n', /line 3, field b: b must not be zero or a negative integer/],
    [['eval', 'hermite'], 'n,x\n3\n', /line 2: expected 2 fields, found 1/],
    [['eval', 'hermite'], 'n,y\n3,1\n', /line 2, field y: unknown parameter/],
    [['eval', 'nothing'], '', /unknown function 'nothing'/],
    [['eval', 'hermite', '--digits', 'many'], 'n,x\n1,1\n', /--digits must be an integer/],
    [['eval', 'gauss-hermite'], '', /needs --n/],
    [['frobnicate'], '', /unknown command/],
  ])('bad input %j exits 2 and names the problem', (args, input, msg) => {
    const r = run(args, input)
    expect(r.code).toBe(2)
    expect(r.err).toMatch(msg)
  })
})
