/**
 * plumbline eval — certified reference values offline.
 *
 *   plumbline eval <id> [--digits D] [--format csv|json] [--kappa] < cases.csv
 *     The CSV header names the parameters (n,x / lambda,x / a,b,z / nu,z …);
 *     every row comes back with `value` (hermite-series: y_even,y_odd) and
 *     `digits` appended (and `kappa` with --kappa).
 *   plumbline eval gauss-hermite --n N [--weight physicists|probabilists] [--digits D]
 *     writes i,node,weight.
 * Bad input exits 2 naming the line and the field.
 */
import { readFileSync } from 'node:fs'
import { CATALOGUE, DomainError, evaluateBatch, gaussHermiteRule, isFunctionId, validateParams, MAX_DIGITS, type EvaluationResult } from '../shared/reference/index'
import { parseCsv, csvField, type CsvRow } from './csv'
import { UsageError, parseOptions } from './usage'

const DEFAULT_DIGITS = 30

const HELP = `usage: plumbline eval <id> [--digits D] [--format csv|json] [--kappa] < cases.csv
       plumbline eval gauss-hermite --n N [--weight physicists|probabilists] [--digits D] [--format csv|json]
functions: ${Object.keys(CATALOGUE).join(', ')}`

function readDigits(v: string | undefined): number {
  if (v === undefined) return DEFAULT_DIGITS
  if (!/^\d+$/.test(v) || Number(v) < 1 || Number(v) > MAX_DIGITS) throw new UsageError(`--digits must be an integer from 1 to ${MAX_DIGITS}`)
  return Number(v)
}

export async function runEval(args: string[]): Promise<number> {
  const { opts, positional } = parseOptions(args, ['digits', 'format', 'n', 'weight'], ['kappa', 'help'])
  if (opts.help) { process.stdout.write(HELP + '\n'); return 0 }
  const id = positional[0]
  if (!id || positional.length > 1) throw new UsageError(`expected one function id\n${HELP}`)
  if (!isFunctionId(id)) throw new UsageError(`unknown function '${id}'\n${HELP}`)
  const digits = readDigits(opts.digits)
  const format = opts.format ?? 'csv'
  if (format !== 'csv' && format !== 'json') throw new UsageError('--format must be csv or json')
  if (id === 'gauss-hermite') return rule(opts, digits, format)
  if (opts.n || opts.weight) throw new UsageError('--n and --weight apply to gauss-hermite only')
  const rows = parseCsv(readFileSync(0, 'utf8'))
  if (rows.length === 0) throw new UsageError('line 1: missing header')
  const header = rows[0]!.fields
  const cases = rows.slice(1).map((r) => toCase(id, header, r))
  let results: EvaluationResult[]
  try {
    results = evaluateBatch(id, cases, digits)
  } catch (err) {
    if (err instanceof DomainError) locate(id, cases, rows.slice(1), digits)
    throw err
  }
  write(id, header, rows.slice(1), results, format, opts.kappa === 'true')
  return 0
}

function toCase(id: string, header: string[], row: CsvRow): Record<string, string> {
  if (row.fields.length !== header.length) {
    throw new UsageError(`line ${row.line}: expected ${header.length} fields, found ${row.fields.length}`)
  }
  const c: Record<string, string> = {}
  header.forEach((h, i) => { c[h] = row.fields[i]! })
  try {
    validateParams(id, c)
  } catch (err) {
    if (err instanceof DomainError) throw new UsageError(`line ${row.line}, field ${err.param ?? '?'}: ${err.message}`)
    throw err
  }
  return c
}

/** A domain error found during evaluation: rerun row by row to name the line. */
function locate(id: string, cases: Array<Record<string, string>>, rows: CsvRow[], digits: number): void {
  cases.forEach((c, i) => {
    try {
      evaluateBatch(id, [c], digits)
    } catch (err) {
      if (err instanceof DomainError) throw new UsageError(`line ${rows[i]!.line}, field ${err.param ?? '?'}: ${err.message}`)
      throw err
    }
  })
}

function write(id: string, header: string[], rows: CsvRow[], results: EvaluationResult[], format: string, kappa: boolean): void {
  const names = CATALOGUE[id as keyof typeof CATALOGUE].outputs
  const extra = [...names, 'digits', ...(kappa ? names.map((n) => (names.length > 1 ? `kappa_${n}` : 'kappa')) : [])]
  const cells = (r: EvaluationResult): string[] => [
    ...r.outputs.map((o) => o.value),
    String(Math.min(...r.outputs.map((o) => o.digits))),
    ...(kappa ? r.outputs.map((o) => o.kappa ?? '') : []),
  ]
  if (format === 'json') {
    const out = results.map((r, i) => {
      const obj: Record<string, string | number | null> = {}
      header.forEach((h, j) => { obj[h] = rows[i]!.fields[j]! })
      for (const o of r.outputs) {
        obj[o.name] = o.value
        if (r.outputs.length > 1) obj[`${o.name}_digits`] = o.digits
        if (kappa) obj[r.outputs.length > 1 ? `kappa_${o.name}` : 'kappa'] = o.kappa
      }
      obj.digits = Math.min(...r.outputs.map((o) => o.digits))
      obj.certification = r.certification
      return obj
    })
    process.stdout.write(JSON.stringify(out, null, 2) + '\n')
    return
  }
  const lines = [[...header, ...extra].map(csvField).join(',')]
  results.forEach((r, i) => lines.push([...rows[i]!.fields, ...cells(r)].map(csvField).join(',')))
  process.stdout.write(lines.join('\n') + '\n')
}

function rule(opts: Record<string, string>, digits: number, format: string): number {
  if (!opts.n || !/^\d+$/.test(opts.n)) throw new UsageError('gauss-hermite needs --n N (an integer ≥ 1)')
  const weight = opts.weight ?? 'physicists'
  if (weight !== 'physicists' && weight !== 'probabilists') throw new UsageError('--weight must be physicists or probabilists')
  let r
  try {
    r = gaussHermiteRule(Number(opts.n), weight, digits)
  } catch (err) {
    if (err instanceof DomainError) throw new UsageError(`--${err.param ?? 'n'}: ${err.message}`)
    throw err
  }
  const short = [...r.nodes, ...r.weights].filter((c) => c.digits < digits).length
  if (short > 0) {
    process.stderr.write(`plumbline: ${short} values could not be certified to ${digits} digits\n`)
    return 1
  }
  if (format === 'json') {
    process.stdout.write(JSON.stringify({ n: r.n, weight, digits, nodes: r.nodes.map((c, i) => ({ i: i + 1, node: c.value, weight: r.weights[i]!.value })) }, null, 2) + '\n')
  } else {
    const lines = ['i,node,weight', ...r.nodes.map((c, i) => `${i + 1},${c.value},${r.weights[i]!.value}`)]
    process.stdout.write(lines.join('\n') + '\n')
  }
  return 0
}
