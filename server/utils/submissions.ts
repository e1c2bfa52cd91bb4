// A submitted output table, from upload to stored run: read the request
// (multipart or JSON), parse the table exactly, match its rows to the set's
// cases, judge every case, and store the run, its raw file and every case
// result in one transaction. A table with unreadable rows is refused whole.
import { createHash } from 'node:crypto'
import type { H3Event } from 'h3'
import Busboy from 'busboy'
import { and, eq } from 'drizzle-orm'
import { MAX_TABLE_BYTES, parseTable, type ParsedTable } from '../../shared/parse'
import { judgeRunInChunks, type RunCase, type RunResult, type RunRows } from '../../shared/compare/run'
import type { ReferenceValue } from '../../shared/compare/judge'
import type { summarizeRun } from '../../shared/compare'
import { CATALOGUE, isFunctionId } from '../../shared/reference'
import { inputKey, isCanonicalPlain } from '../../shared/grid/keys'
import { submissionSchema, type Environment, type SubmissionFields } from '../../shared/schemas/submission'
import { describeConflict, reconcileBuild, type RecordedBuild } from '../../shared/domain/build'
import type { Criterion } from '../../shared/schemas/criterion'
import type { ReferenceSet } from '../database/schema'

export interface Upload { fileName: string, data: Buffer, fields: Record<string, unknown> }

const tooLarge = () => httpError(413, 'too_large', `The table is larger than ${MAX_TABLE_BYTES / 1024 / 1024} MB. Split it into several runs or drop columns that are not needed.`)

/** Read a multipart upload (`file` plus fields) or a JSON body with the table in `content`. */
export async function readUpload(event: H3Event): Promise<Upload> {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > MAX_TABLE_BYTES + 1024 * 1024) throw tooLarge()
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (type.startsWith('multipart/form-data')) {
    const { file, fields } = await readMultipart(event)
    if (!file) throw httpError(400, 'invalid_input', 'Invalid upload: file: attach the output table as the field "file".', { issues: [{ field: 'file', message: 'Attach the output table.' }] })
    const json = (k: string) => {
      const v = fields[k]
      if (typeof v !== 'string' || !v) return undefined
      try {
        return JSON.parse(v) as unknown
      }
      catch {
        throw httpError(400, 'invalid_input', `Invalid upload: ${k}: not valid JSON.`, { issues: [{ field: k, message: 'Not valid JSON.' }] })
      }
    }
    return { ...file, fields: { ...fields, mapping: json('mapping'), environment: json('environment') } }
  }
  const body = await readJsonBody(event) as Record<string, unknown>
  if (typeof body.content !== 'string') {
    throw httpError(400, 'invalid_input', 'Invalid body: content: send the table as multipart field "file", or as the string "content" in JSON.', { issues: [{ field: 'content', message: 'Missing the table.' }] })
  }
  const data = Buffer.from(body.content, 'utf8')
  if (data.length > MAX_TABLE_BYTES) throw tooLarge()
  const { content: _content, fileName, ...fields } = body
  return { fileName: typeof fileName === 'string' ? fileName : 'table', data, fields }
}

/**
 * Stream a multipart body through busboy: the part named `file` is the
 * table (held once, as one Buffer), every other text part a field. A file
 * over the size limit is refused with 413 as soon as it passes the limit.
 */
function readMultipart(event: H3Event): Promise<{ file: { fileName: string, data: Buffer } | null, fields: Record<string, string> }> {
  const req = event.node.req
  return new Promise((resolve, reject) => {
    let parser: Busboy.Busboy
    try {
      parser = Busboy({ headers: req.headers, limits: { fileSize: MAX_TABLE_BYTES, fieldSize: 1024 * 1024, fields: 100 } })
    }
    catch (e) {
      reject(httpError(400, 'invalid_input', `Invalid upload: ${e instanceof Error ? e.message : String(e)}.`, { issues: [{ field: 'file', message: 'Not a readable multipart body.' }] }))
      return
    }
    const fields: Record<string, string> = {}
    let file: { fileName: string, data: Buffer } | null = null
    let failed = false
    const fail = (e: unknown) => {
      if (failed) return
      failed = true
      req.unpipe(parser)
      req.resume() // drain what is left so the answer can be sent
      reject(e)
    }
    parser.on('field', (name, value) => { fields[name] = value })
    parser.on('file', (name, stream, info) => {
      if (name !== 'file') { stream.resume(); return }
      const parts: Buffer[] = []
      stream.on('data', (b: Buffer) => parts.push(b))
      stream.on('limit', () => fail(tooLarge()))
      stream.on('end', () => { if (!failed) file = { fileName: info.filename || 'table', data: Buffer.concat(parts) } })
    })
    parser.on('error', (e: unknown) => fail(httpError(400, 'invalid_input', `Invalid upload: ${e instanceof Error ? e.message : String(e)}.`, { issues: [{ field: 'file', message: 'Not a readable multipart body.' }] })))
    parser.on('close', () => { if (!failed) resolve({ file, fields }) })
    req.on('error', fail)
    req.pipe(parser)
  })
}

export function submissionFields(upload: Upload): SubmissionFields {
  return parseOr400(submissionSchema, upload.fields, 'upload')
}

/** Parse exactly; refuse the whole file if any row cannot be read (413 when too large). */
export function parseUploadedTable(data: Uint8Array): ParsedTable {
  const table = parseTable(data)
  const tooBig = table.errors.find(e => e.kind === 'too-large')
  if (tooBig) throw httpError(413, 'too_large', `The table was refused: ${tooBig.message}.`)
  if (table.errorCount > 0) {
    const errors = table.errors.map(e => ({ line: e.line, column: e.column, field: e.field, message: e.message }))
    throw httpError(400, 'unreadable_rows', `The table was refused: ${table.errorCount} problem${table.errorCount === 1 ? '' : 's'}, first at line ${errors[0]?.line}: ${errors[0]?.message}`, { errors, errorCount: table.errorCount })
  }
  return table
}

/** The columns that hold each parameter and the value; parameters with a catalogue default may be left out. */
export function resolveMapping(set: ReferenceSet, table: ParsedTable, mapping: Record<string, string> | undefined, suggest: (cols: string[], params: string[]) => Record<string, string | undefined>) {
  if (!isFunctionId(set.functionId)) throw httpError(500, 'bad_set', `Set ${set.id} names an unknown function.`)
  const specs = CATALOGUE[set.functionId].parameters
  const chosen = mapping ?? Object.fromEntries(Object.entries(suggest(table.columns, specs.map(p => p.name))).filter(([, v]) => v !== undefined)) as Record<string, string>
  const index: Record<string, number> = {}
  const issues: { field: string, message: string }[] = []
  for (const key of [...specs.map(p => p.name), 'value']) {
    const col = chosen[key]
    const spec = specs.find(p => p.name === key)
    if (!col) {
      if (!spec || spec.default === undefined) issues.push({ field: `mapping.${key}`, message: `Choose the column that holds ${key === 'value' ? 'the computed value' : key}.` })
      continue
    }
    const j = table.columns.indexOf(col)
    if (j < 0) issues.push({ field: `mapping.${key}`, message: `There is no column "${col}"; the table has ${table.columns.join(', ')}.` })
    else index[key] = j
  }
  if (issues.length) throw httpError(400, 'invalid_input', `Invalid mapping: ${issues.map(i => i.message).join(' ')}`, { issues })
  return { index, mapping: Object.fromEntries(Object.entries(index).map(([k, j]) => [k, table.columns[j]!])) }
}

type StoredResult = typeof schema.caseResults.$inferInsert

const EMPTY_FIELD = { raw: '', kind: 'empty' } as const

const key = (s: string | null | undefined) => (s === null || s === undefined || s === '' ? null : Number(s))

/**
 * A run being judged: `chunks` hands out the rows to store, in the order of
 * shared/compare/run.ts, a chunk at a time as they are judged, and returns
 * the summary once all are. Storing one chunk while the next is judged keeps
 * both cores busy (server/utils/run-store.ts).
 */
export interface JudgedRun {
  chunks: Generator<StoredResult[], JudgedSummary>
}

export interface JudgedSummary {
  summary: ReturnType<typeof summarizeRun>
  /** The stored row of the summary's worst case, to find its id once stored. */
  worst: StoredResult | null
}

/** Judge every case of the set against the table's rows (shared/compare/run.ts), as rows ready to store. */
export function judgeTable(set: ReferenceSet, cases: CaseToJudge[], table: ParsedTable, index: Record<string, number>, chunkSize = 5000): JudgedRun {
  const params = Object.keys(index).filter(k => k !== 'value')
  const specs = isFunctionId(set.functionId) ? CATALOGUE[set.functionId].parameters : []
  const functionId = set.functionId
  // A row's inputs, built when asked for (to match it, and to store a row that matches no case).
  const inputsOf = (rowIndex: number) => {
    const fields = table.rows[rowIndex]!.fields
    const inputs: Record<string, string> = {}
    // inputs by their exact value, so 0x1p-1, 5.0D-01 and 0.5 all name the case x = 0.5
    for (const p of params) {
      const f = fields[index[p]!]
      // (text already in canonical form is kept as written, which spares matching from re-reading it)
      inputs[p] = f?.kind === 'number' && f.value !== undefined ? (isCanonicalPlain(f.raw) ? f.raw : f.value) : f?.raw ?? ''
    }
    for (const s of specs) if (inputs[s.name] === undefined && s.default !== undefined) inputs[s.name] = s.default
    return inputs
  }
  const valueColumn = index.value!
  const rows: RunRows = {
    length: table.rows.length,
    key: i => inputKey(inputsOf(i), functionId),
    measured: i => table.rows[i]!.fields[valueColumn] ?? EMPTY_FIELD,
  }
  const lineOf = (rowIndex: number | null) => (rowIndex === null ? null : table.rows[rowIndex]!.line)
  const toStored = (r: RunResult): StoredResult => {
    const c = r.caseIndex === null ? null : cases[r.caseIndex]!
    const dup = r.verdict === 'duplicate' ? /^duplicate-of-row:(\d+)$/.exec(r.decidedBy) : null
    return {
      runId: 0, caseId: c?.id ?? null, lineNumber: lineOf(r.rowIndex),
      // a case's inputs live with the case; only rows that match no case keep their own
      inputs: c ? null : (r.rowIndex === null ? null : inputsOf(r.rowIndex)), measured: r.measured,
      absError: r.absError, relError: r.relError, ulps: r.ulps, digitsAgreed: r.digitsAgreed === null ? null : String(r.digitsAgreed),
      region: r.region ?? null, relErrorKey: key(r.relError), absErrorKey: key(r.absError), ulpsKey: key(r.ulps),
      verdict: r.verdict, decidedBy: dup ? `repeats line ${lineOf(Number(dup[1]))}` : r.decidedBy.slice(0, 60),
    }
  }
  function* chunks(): Generator<StoredResult[], JudgedSummary> {
    const steps = judgeRunInChunks(functionId, cases, rows, set.criterion as Criterion, chunkSize)
    for (let step = steps.next(); ; step = steps.next()) {
      if (step.done) {
        const { summary, worst } = step.value
        return { summary, worst: worst ? toStored(worst) : null }
      }
      yield step.value.map(toStored)
    }
  }
  return { chunks: chunks() }
}

/**
 * A set's case as judging needs it. The inputs stay JSON text until asked
 * for: judging reads the stored region, so they are parsed only for a case
 * whose region must be worked out again.
 */
export class CaseToJudge implements RunCase {
  constructor(
    readonly id: number,
    private readonly inputsJson: string,
    readonly inputKey: string,
    readonly referenceValue: string,
    readonly certifiedDigits: number,
    readonly conditionNumber: string | null,
    readonly region: string,
  ) {}

  get inputs(): Record<string, string> {
    return JSON.parse(this.inputsJson) as Record<string, string>
  }

  get key(): string {
    return this.inputKey
  }

  /** Made when the case is judged, and dropped after. */
  get reference(): ReferenceValue {
    return { value: this.referenceValue, digits: this.certifiedDigits, kappa: this.conditionNumber, exact: this.referenceValue === '0' }
  }
}

const CASES_SQL = 'SELECT id, inputs, input_key, reference_value, certified_digits, condition_number, region FROM cases WHERE set_id = ? ORDER BY ordinal'

/**
 * A set's cases in order, with only what judging needs: one plain query
 * returning arrays of text, so 100,000 cases come in without building an
 * object per column or parsing JSON (server/database/schema.ts, table cases).
 */
export async function loadCases(setId: number): Promise<CaseToJudge[]> {
  const [rows] = await usePool().query({ sql: CASES_SQL, values: [setId], rowsAsArray: true, typeCast: (field, next) => (field.type === 'JSON' || field.type === 'BLOB' ? field.string() : next()) })
  return (rows as Array<[number, string, string, string, number, string | null, string]>).map(r => new CaseToJudge(Number(r[0]), r[1], r[2], r[3], r[4], r[5], r[6]))
}

export const sha256Hex = (data: Uint8Array) => createHash('sha256').update(data).digest('hex')

export async function findCode(slug: string) {
  const [code] = await useDb().select().from(schema.codes).where(eq(schema.codes.slug, slug))
  if (!code) throw httpError(404, 'not_found', `There is no code "${slug}".`, { issues: [{ field: 'code', message: 'No such code.' }] })
  return code
}

export async function findVersion(codeId: number, label: string) {
  const [v] = await useDb().select().from(schema.versions).where(and(eq(schema.versions.codeId, codeId), eq(schema.versions.label, label)))
  return v ?? null
}

/**
 * The build details of a submission for an existing version, against what the
 * version records (shared/domain/build.ts): a 409 naming each field that
 * contradicts it; otherwise the version's build with the fields it lacks
 * filled in, or null when the submission adds nothing.
 */
export function checkBuild(version: { label: string, commitId: string, environment: unknown }, fields: Pick<SubmissionFields, 'commit' | 'environment'>): RecordedBuild | null {
  const { conflicts, filled } = reconcileBuild({ commitId: version.commitId, environment: version.environment as Environment }, fields)
  if (conflicts.length) {
    throw httpError(409, 'build_differs', `${conflicts.map(c => describeConflict(version.label, c)).join(' ')} A different build is a different version: submit it under a label of its own, or leave the field out.`, {
      issues: conflicts.map(c => ({ field: c.field, message: describeConflict(version.label, c) })),
    })
  }
  return filled
}

export async function findDuplicateRun(versionId: number, setId: number, sha: string) {
  const [r] = await useDb().select({ id: schema.runs.id, counts: schema.runs.counts }).from(schema.runs)
    .where(and(eq(schema.runs.versionId, versionId), eq(schema.runs.setId, setId), eq(schema.runs.fileSha256, sha)))
  return r ?? null
}
