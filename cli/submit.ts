/**
 * plumbline submit — post an output table from CI and gate the pipeline on it.
 *
 *   plumbline submit --server URL --token T --code C --version V --set S
 *                    [--commit SHA] [--env-file F] [--mapping JSON] [--json] [--junit F] FILE
 *
 * Exit status: 0 every case passes or is accepted, 1 any case fails (or is
 * missing, unexpected, non-finite, duplicated), 2 bad input or usage (also a
 * request the server refuses: unreadable rows, unknown code, bad token),
 * 3 server or network error.
 */
import { readFileSync, writeFileSync } from 'node:fs'
import { basename, resolve } from 'node:path'
import { environmentSchema, setSlugSchema } from '../shared/schemas/submission'
import { failures } from '../shared/domain/board'
import type { RunDetail } from '../shared/domain/api-types'
import { CAUTION, caseName, runToJunit, type JunitCase } from './junit'
import { UsageError, parseOptions } from './usage'

export const HELP = `usage: plumbline submit --server URL --token T --code C --version V --set S
                        [--commit SHA] [--env-file F] [--mapping JSON] [--json] [--junit F] FILE
  --server URL     Plumbline's address (or PLUMBLINE_SERVER)
  --token T        a CI token of scope submit for this code (or PLUMBLINE_TOKEN)
  --code C         the code's slug, e.g. oscillite
  --version V      the version label; a new label makes a new version
  --set S          the reference set: its slug for its newest revision (follows revisions),
                   or its id (the number in its page's address) for that one revision
  --commit SHA     the commit the table was built from
  --env-file F     JSON with the build environment: compiler, flags, platform, floatFormat, libraries
  --mapping JSON   which column holds which parameter, e.g. {"n":"n","x":"x","value":"H"}
  --json           print the result as JSON instead of a summary
  --junit F        also write the cases as JUnit XML to F
exit status: 0 all cases pass or are accepted, 1 some case fails, 2 bad input or usage, 3 server or network error`

/** The server or the network failed: exit 3. */
export class ServerError extends Error {}

/** A request the server refused as bad input (4xx): exit 2, with the server's words. */
class RefusedError extends UsageError {}

/** The parts of the server's JSON replies this command reads. */
interface ServerBody {
  message?: string
  data?: { code?: string, errors?: { line: number, column: number, field?: string, message: string }[], issues?: { field: string, message: string }[] }
  run?: RunDetail
  duplicate?: boolean
  rows?: JunitCase[]
  cases?: JunitCase[]
}

interface Reply { status: number, body: ServerBody }

/** Paths the user gave are relative to where they ran the command, even through `npm run` (which moves to the package root). */
function userPath(p: string): string {
  const base = process.env.npm_lifecycle_event === 'plumbline' && process.env.INIT_CWD ? process.env.INIT_CWD : process.cwd()
  return resolve(base, p)
}

function readUserFile(p: string, what: string): Buffer {
  try {
    return readFileSync(userPath(p))
  }
  catch (e) {
    const code = (e as NodeJS.ErrnoException).code
    throw new UsageError(`cannot read ${what} ${p}: ${code === 'ENOENT' ? 'no such file' : code ?? String(e)}`)
  }
}

function explainRefusal(r: Reply): string {
  const b: ServerBody = r.body && typeof r.body === 'object' ? r.body : {}
  const lines = [`the server refused the request (${r.status}${b.data?.code ? ` ${b.data.code}` : ''}): ${b.message ?? '(no message)'}`]
  for (const e of (b.data?.errors ?? []).slice(0, 10)) lines.push(`  line ${e.line}, column ${e.column}${e.field ? ` (${e.field})` : ''}: ${e.message}`)
  for (const i of (b.data?.issues ?? []).slice(0, 10)) lines.push(`  ${i.field}: ${i.message}`)
  return lines.join('\n')
}

async function call(method: string, url: string, token: string, body?: FormData): Promise<Reply> {
  let res: Response
  try {
    res = await fetch(url, { method, body, headers: { authorization: `Bearer ${token}`, accept: 'application/json' }, signal: AbortSignal.timeout(10 * 60_000) })
  }
  catch (e) {
    const cause = (e as { cause?: { code?: string, message?: string } }).cause
    throw new ServerError(`cannot reach ${new URL(url).origin}: ${cause?.code ?? cause?.message ?? (e as Error).message}`)
  }
  const text = await res.text()
  let parsed: unknown
  try {
    parsed = JSON.parse(text)
  }
  catch {
    throw new ServerError(`the server answered ${res.status} with something that is not JSON: ${text.slice(0, 200)}`)
  }
  const reply: Reply = { status: res.status, body: (parsed ?? {}) as ServerBody }
  if (res.status >= 500) throw new ServerError(`the server failed (${res.status}): ${reply.body?.message ?? text.slice(0, 200)}`)
  if (res.status >= 400) throw new RefusedError(explainRefusal(reply))
  return reply
}

function options(args: string[]) {
  const { opts, positional } = parseOptions(args, ['server', 'token', 'code', 'version', 'set', 'commit', 'env-file', 'mapping', 'junit'], ['json', 'help'])
  if (opts.help) return null
  const server = opts.server ?? process.env.PLUMBLINE_SERVER
  const token = opts.token ?? process.env.PLUMBLINE_TOKEN
  const missing = [['server', server], ['token', token], ['code', opts.code], ['version', opts.version], ['set', opts.set]].filter(([, v]) => !v).map(([k]) => `--${k}`)
  if (missing.length) throw new UsageError(`missing ${missing.join(', ')}\n${HELP}`)
  if (positional.length !== 1) throw new UsageError(`expected one table file, got ${positional.length}\n${HELP}`)
  if (!URL.canParse(server!) || !/^https?:$/.test(new URL(server!).protocol)) throw new UsageError(`--server must be an http(s) address, e.g. http://127.0.0.1:3000; got '${server}'`)
  const byId = /^\d+$/.test(opts.set!)
  if (byId ? Number(opts.set) < 1 : !setSlugSchema.safeParse(opts.set).success) {
    throw new UsageError(`--set takes the reference set's slug (e.g. hermite-core) or its id (a positive whole number); got '${opts.set}'`)
  }
  if (opts.mapping) {
    try {
      JSON.parse(opts.mapping)
    }
    catch {
      throw new UsageError(`--mapping must be JSON, e.g. {"n":"n","x":"x","value":"H"}`)
    }
  }
  return {
    server: server!.replace(/\/+$/, ''), token: token!, file: positional[0]!, code: opts.code!, version: opts.version!, set: opts.set!, setField: byId ? 'setId' : 'set',
    commit: opts.commit, envFile: opts['env-file'], mapping: opts.mapping, junit: opts.junit, json: opts.json === 'true',
  }
}

function environmentFrom(file: string): string {
  const text = readUserFile(file, 'the environment file').toString('utf8')
  let json: unknown
  try {
    json = JSON.parse(text)
  }
  catch (e) {
    throw new UsageError(`the environment file ${file} is not JSON: ${(e as Error).message}`)
  }
  const check = environmentSchema.strict().safeParse(json)
  if (!check.success) {
    throw new UsageError(`the environment file ${file}: ${check.error.issues.map(i => `${i.path.join('.') || '(top)'}: ${i.message}`).join('; ')}`)
  }
  return JSON.stringify(check.data)
}

export async function runSubmit(args: string[]): Promise<number> {
  const o = options(args)
  if (!o) {
    process.stdout.write(HELP + '\n')
    return 0
  }
  const data = readUserFile(o.file, 'the table')
  const form = new FormData()
  form.append('code', o.code)
  form.append('version', o.version)
  form.append(o.setField, o.set)
  if (o.commit) form.append('commit', o.commit)
  if (o.envFile) form.append('environment', environmentFrom(o.envFile))
  if (o.mapping) form.append('mapping', o.mapping)
  form.append('file', new Blob([new Uint8Array(data)]), basename(o.file))

  const posted = await call('POST', `${o.server}/api/runs`, o.token, form)
  const runId = Number(posted.body?.run?.id)
  if (!Number.isInteger(runId)) throw new ServerError(`the server's reply names no run: ${JSON.stringify(posted.body).slice(0, 200)}`)
  const run = (await call('GET', `${o.server}/api/runs/${runId}`, o.token)).body.run
  if (!run) throw new ServerError(`the server did not return run ${runId}`)
  const url = `${o.server}/runs/${runId}`
  const failing = failures(run.summary.counts)
  const worst = failing
    ? (await call('GET', `${o.server}/api/runs/${runId}/cases?verdict=fail,missing,unexpected,non_finite,duplicate&sort=relError&dir=desc&pageSize=5`, o.token)).body.rows ?? []
    : []

  if (o.junit) {
    const cases = (await call('GET', `${o.server}/api/runs/${runId}/export?format=json`, o.token)).body.cases ?? []
    const xml = runToJunit({ id: runId, url, code: run.code.slug, version: run.version.label, set: run.set, createdAt: run.createdAt, fileSha256: run.fileSha256 }, cases)
    try {
      writeFileSync(userPath(o.junit), xml)
    }
    catch (e) {
      throw new UsageError(`cannot write the JUnit file ${o.junit}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`)
    }
  }

  const exit = failing > 0 ? 1 : 0
  if (o.json) {
    process.stdout.write(JSON.stringify({
      run: { id: runId, url, code: run.code.slug, version: run.version.label, set: { id: run.set.id, slug: run.set.slug, revision: run.set.revision }, counts: run.summary.counts, total: run.summary.total, maxRelError: run.summary.maxRelError, maxUlps: run.summary.maxUlps, state: run.state },
      duplicate: posted.body.duplicate === true,
      passed: exit === 0,
      failures: failing,
      worst: worst.map(c => ({ case: caseName(c), verdict: c.verdict, relError: c.relError, ulps: c.ulps, measured: c.measured, reference: c.reference })),
      caution: CAUTION,
    }, null, 2) + '\n')
    return exit
  }
  const counts = Object.entries(run.summary.counts).filter(([, n]) => n > 0).map(([v, n]) => `${n} ${v}`).join(', ')
  const lines = [
    `${exit === 0 ? 'PASSED' : 'FAILED'}  ${run.code.slug} ${run.version.label} against ${run.set.slug} r${run.set.revision}: ${run.summary.total} cases (${counts || 'none'})${posted.body.duplicate ? ' — this table was submitted before; showing that run' : ''}`,
    `  max relative error ${run.summary.maxRelError ?? '—'}, max ULPs ${run.summary.maxUlps ?? '—'}`,
  ]
  if (worst.length) {
    lines.push('  worst cases:')
    for (const c of worst) lines.push(`    ${c.verdict.padEnd(10)} ${caseName(c)}${c.relError ? `  relative error ${c.relError}` : ''}${c.ulps ? `  ${c.ulps} ULPs` : ''}`)
  }
  lines.push(`  run: ${url}`, `  ${CAUTION}`)
  process.stdout.write(lines.join('\n') + '\n')
  return exit
}
