// The real `plumbline submit` command against the running test server: each
// exit status, the JSON and JUnit outputs, bad flags, and running from another
// directory (as when the package is installed elsewhere).
import { execFile } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { XMLParser } from 'fast-xml-parser'
import { beforeAll, describe, expect, it } from 'vitest'
import { BASE, type Client, signedIn, unique } from '../support/api'
import { hermiteDouble, hermiteSet, readySet, reviseSet } from '../support/sets'

const ROOT = resolve(import.meta.dirname, '../..')
const BIN = join(ROOT, 'cli/bin.mjs')
const DEMO_TOKEN = 'plb_demo_oscillite_7f3c2a9e51d84b06'
const work = mkdtempSync(join(tmpdir(), 'plumbline-cli-'))

let qa: Client
let setId: string

const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
function table(off: (n: number, x: string) => boolean = () => false) {
  return ['n,x,H', ...NS.flatMap(n => XS.map(x => `${n},${x},${(hermiteDouble(n, Number(x)) * (off(n, x) ? 1 + 1e-9 : 1)).toPrecision(17)}`))].join('\n') + '\n'
}

function file(name: string, content: string) {
  writeFileSync(join(work, name), content)
  return name
}

/** Run the CLI from `work` (not the project folder) with relative file paths. */
function cli(args: string[], opts: { viaNpm?: boolean } = {}): Promise<{ code: number, out: string, err: string }> {
  const [cmd, argv] = opts.viaNpm
    ? ['npm', ['run', '--silent', '--prefix', ROOT, 'plumbline', '--', ...args]]
    : [process.execPath, [BIN, ...args]]
  return new Promise((done) => {
    execFile(cmd, argv, { cwd: work, env: { ...process.env, PLUMBLINE_TOKEN: '', PLUMBLINE_SERVER: '' }, timeout: 120_000 }, (error, stdout, stderr) => {
      done({ code: error ? (typeof error.code === 'number' ? error.code : -1) : 0, out: stdout, err: stderr })
    })
  })
}

const submit = (token: string, fileName: string, extra: string[] = []) =>
  ['submit', '--server', BASE, '--token', token, '--code', 'oscillite', '--version', unique('cli'), '--set', setId, ...extra, fileName]

beforeAll(async () => {
  qa = await signedIn('qa')
  setId = String((await readySet(qa, hermiteSet(unique('cli-set')))).id)
})

describe('plumbline submit', () => {
  it('exits 0 with a short summary when every case passes (demo token, run from another directory)', async () => {
    const r = await cli(submit(DEMO_TOKEN, file('good.csv', table())))
    expect(r.err).toBe('')
    expect(r.code).toBe(0)
    expect(r.out).toMatch(/^PASSED {2}oscillite cli-\S+ against cli-set-\S+ r1: 20 cases \(20 pass\)/)
    expect(r.out).toMatch(new RegExp(`run: ${BASE}/runs/\\d+`))
    expect(r.out).toMatch(/does not replace your organisation's QA programme/)
  })

  it('exits 1 when a case fails, and says which in JSON', async () => {
    const r = await cli(submit(DEMO_TOKEN, file('off.csv', table((n, x) => n === 8 && x === '0.5')), ['--json']))
    expect(r.code).toBe(1)
    const out = JSON.parse(r.out)
    expect(out).toMatchObject({ passed: false, failures: 1, duplicate: false, run: { code: 'oscillite', total: 20, counts: { pass: 19, fail: 1 } } })
    expect(out.worst).toHaveLength(1)
    expect(out.worst[0]).toMatchObject({ case: 'n=8 x=0.5', verdict: 'fail' })
    expect(Number(out.worst[0].relError)).toBeGreaterThan(1e-10)
    expect(out.run.url).toBe(`${BASE}/runs/${out.run.id}`)
  })

  it('writes one JUnit testcase per case, with the failures marked', async () => {
    const name = file('junit-in.csv', table((n, x) => n === 12 && (x === '1' || x === '-1')))
    const r = await cli(submit(DEMO_TOKEN, name, ['--junit', 'out/../report.xml', '--commit', 'abc123']))
    expect(r.code).toBe(1)
    const xml = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: n => n === 'testcase' || n === 'property' }).parse(readFileSync(join(work, 'report.xml'), 'utf8'))
    const suite = xml.testsuites.testsuite
    expect(xml.testsuites).toMatchObject({ name: 'plumbline', tests: '20', failures: '2' })
    expect(suite.testcase).toHaveLength(20)
    const failed = suite.testcase.filter((t: { failure?: unknown }) => t.failure)
    expect(failed.map((t: { name: string }) => t.name).sort()).toEqual(['n=12 x=-1', 'n=12 x=1'])
    expect(failed[0].failure.type).toBe('fail')
    expect(failed[0].failure['#text']).toMatch(/reference: /)
    expect(suite.properties.property.find((p: { name: string }) => p.name === 'caution').value).toMatch(/QA programme/)
  })

  it('names the set by its slug, judging against its newest revision', async () => {
    const slug = unique('cli-slug')
    const first = await readySet(qa, hermiteSet(slug))
    const newest = await reviseSet(qa, first.id, hermiteSet(slug, { targetDigits: 21 }))
    const args = ['submit', '--server', BASE, '--token', DEMO_TOKEN, '--code', 'oscillite', '--version', unique('cli-slug'), '--set', slug, '--json', file('slug.csv', table())]
    const r = await cli(args)
    expect(r.err).toBe('')
    expect(r.code).toBe(0)
    expect(JSON.parse(r.out).run.set).toEqual({ id: newest.id, slug, revision: 2 })
  })

  it('counts missing cases as failing and sends the build environment from --env-file', async () => {
    const lines = table().trim().split('\n')
    const env = file('env.json', JSON.stringify({ compiler: 'gfortran 14.2', flags: '-O2', platform: 'x86_64-linux', floatFormat: 'binary64' }))
    const version = unique('cli-env')
    const args = ['submit', '--server', BASE, '--token', DEMO_TOKEN, '--code', 'oscillite', '--version', version, '--set', setId, '--env-file', env, '--json', file('short.csv', lines.slice(0, -1).join('\n') + '\n')]
    const r = await cli(args)
    expect(r.code).toBe(1)
    expect(JSON.parse(r.out).run.counts.missing).toBe(1)
    const code = await qa.get('/api/codes/oscillite')
    expect(code.body.versions.find((v: { label: string }) => v.label === version).environment).toMatchObject({ compiler: 'gfortran 14.2', floatFormat: 'binary64' })
  })

  it('works through npm run from another directory, with the file path relative to that directory', async () => {
    const r = await cli(submit(DEMO_TOKEN, file('npm.csv', table()), ['--json']), { viaNpm: true })
    expect(r.err).toBe('')
    expect(r.code).toBe(0)
    expect(JSON.parse(r.out).passed).toBe(true)
  })

  it.each([
    [['submit'], /missing --server, --token, --code, --version, --set/],
    [['submit', '--server', BASE, '--token', 't', '--code', 'oscillite', '--version', '1', '--set', '1'], /expected one table file/],
    [['submit', '--frobnicate'], /unknown option '--frobnicate'/],
    [['submit', '--server', 'ftp://x', '--token', 't', '--code', 'c', '--version', '1', '--set', '1', 'f.csv'], /--server must be an http\(s\) address/],
    [['submit', '--server', BASE, '--token', 't', '--code', 'c', '--version', '1', '--set', 'Core Set', 'f.csv'], /--set takes the reference set's slug \(e\.g\. hermite-core\) or its id/],
    [['submit', '--server', BASE, '--token', 't', '--code', 'c', '--version', '1', '--set', '0', 'f.csv'], /--set takes the reference set's slug .* got '0'/],
    [['submit', '--server', BASE, '--token', 't', '--code', 'c', '--version', '1', '--set', '1', 'no-such-file.csv'], /cannot read the table no-such-file.csv: no such file/],
    [['submit', '--server', BASE, '--token', 't', '--code', 'c', '--version', '1', '--set', '1', '--mapping', '{oops', 'f.csv'], /--mapping must be JSON/],
  ])('bad usage %j exits 2 and says why', async (args, message) => {
    file('f.csv', 'n,x,H\n')
    const r = await cli(args)
    expect(r.code).toBe(2)
    expect(r.err).toMatch(message)
  })

  it('exits 2 for an environment file with a bad field', async () => {
    const env = file('bad-env.json', JSON.stringify({ compiler: 'x', colour: 'blue' }))
    const r = await cli(submit(DEMO_TOKEN, file('g.csv', table()), ['--env-file', env]))
    expect(r.code).toBe(2)
    expect(r.err).toMatch(/bad-env.json: .*colour/)
  })

  it('exits 2 when the server refuses the table, naming the line and column', async () => {
    const r = await cli(submit(DEMO_TOKEN, file('bad.csv', 'n,x,H\n0,-1,1\n0,-0.5,1.2.3\n')))
    expect(r.code).toBe(2)
    expect(r.err).toMatch(/refused the request \(400 unreadable_rows\)/)
    expect(r.err).toMatch(/line 3, column \d+/)
  })

  it('exits 2 for a dead token and for a code that is not the token\'s', async () => {
    const dead = await cli(submit('plb_no_such_token', file('h.csv', table())))
    expect(dead.code).toBe(2)
    expect(dead.err).toMatch(/401 bad_token/)
    const other = await cli(['submit', '--server', BASE, '--token', DEMO_TOKEN, '--code', 'quadrat', '--version', '1', '--set', setId, 'h.csv'])
    expect(other.code).toBe(2)
    expect(other.err).toMatch(/403 token_wrong_code/)
  })

  it('exits 3 when the server cannot be reached', async () => {
    const r = await cli(['submit', '--server', 'http://127.0.0.1:9', '--token', DEMO_TOKEN, '--code', 'oscillite', '--version', '1', '--set', setId, file('n.csv', table())])
    expect(r.code).toBe(3)
    expect(r.err).toMatch(/cannot reach http:\/\/127.0.0.1:9/)
  })

  it('prints its help with exit 0', async () => {
    const r = await cli(['submit', '--help'])
    expect(r.code).toBe(0)
    expect(r.out).toMatch(/exit status: 0 all cases pass/)
  })
})
