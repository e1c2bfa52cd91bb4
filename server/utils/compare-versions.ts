// Comparing two versions of a code on one reference-set slug: the latest run
// of each, case by case (cases matched by their exact inputs, so two
// revisions of a set compare where they share cases). Sorting, filtering and
// paging happen in SQL, so a set of 100,000 cases is one page at a time.
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm'
import { FAILING } from '../../shared/domain/board'
import type { CompareReply, CompareRow } from '../../shared/domain/api-types'
import type { CompareQuery } from '../../shared/schemas/compare'

/** An error more than twice the older one is "worse", less than half is "better". */
export const WORSE_FACTOR = 2
export const COMPARE_RULE = `Cases are matched by their exact inputs. Newly failing: passed (or accepted) in the older version, fails now. Fixed: the reverse. Worse / better: both pass, and the relative error grew / shrank by more than a factor of ${WORSE_FACTOR}.`

const list = (vs: readonly string[]) => sql.join(vs.map(v => sql`${v}`), sql`, `)
const FAIL = list(FAILING)
const OK = list(['pass', 'accepted'])

function kindExpr(): SQL {
  return sql`CASE
    WHEN fr.verdict IS NULL THEN 'new-case'
    WHEN fr.verdict IN (${OK}) AND tr.verdict IN (${FAIL}) THEN 'newly-failing'
    WHEN fr.verdict IN (${FAIL}) AND tr.verdict IN (${OK}) THEN 'fixed'
    WHEN fr.verdict IN (${FAIL}) AND tr.verdict IN (${FAIL}) THEN 'still-failing'
    WHEN tr.rel_error_key > ${WORSE_FACTOR} * fr.rel_error_key THEN 'worse'
    WHEN tr.rel_error_key * ${WORSE_FACTOR} < fr.rel_error_key THEN 'better'
    ELSE 'same' END`
}

// newly failing without a finite error (non-finite, missing) ranks as the largest regression
const changeExpr = sql`CASE
  WHEN tr.rel_error_key IS NULL AND tr.verdict IN (${FAIL}) AND (fr.verdict IS NULL OR fr.verdict NOT IN (${FAIL})) THEN 1e300
  WHEN tr.rel_error_key IS NULL OR fr.rel_error_key IS NULL THEN NULL
  ELSE tr.rel_error_key - fr.rel_error_key END`

export async function compareCodeVersions(code: { id: number, slug: string, name: string }, q: CompareQuery): Promise<CompareReply> {
  const db = useDb()
  const versions = await db.select({ id: schema.versions.id, label: schema.versions.label }).from(schema.versions)
    .where(and(eq(schema.versions.codeId, code.id), inArray(schema.versions.label, [q.from, q.to])))
  const from = versions.find(v => v.label === q.from)
  const to = versions.find(v => v.label === q.to)
  if (!from || !to) {
    const field = from ? 'to' : 'from'
    throw httpError(404, 'not_found', `${code.name} has no version "${q[field]}".`, { issues: [{ field, message: 'No such version.' }] })
  }
  const latest = await latestRuns([from.id, to.id], q.set)
  const fromRun = latest.find(r => r.versionId === from.id)
  const toRun = latest.find(r => r.versionId === to.id)
  if (!fromRun || !toRun) {
    const field = fromRun ? 'to' : 'from'
    throw httpError(404, 'no_run', `Version ${q[field]} of ${code.name} has no run on reference set ${q.set}; choose versions that were both judged against it.`, { issues: [{ field, message: 'No run on this set.' }] })
  }
  const runs = await db.select({ id: schema.runs.id, setId: schema.runs.setId, maxRelError: schema.runs.maxRelError }).from(schema.runs).where(inArray(schema.runs.id, [fromRun.id, toRun.id]))
  const fr0 = runs.find(r => r.id === fromRun.id)!
  const tr0 = runs.find(r => r.id === toRun.id)!
  const [set] = await db.select({ name: schema.referenceSets.name }).from(schema.referenceSets).where(eq(schema.referenceSets.id, tr0.setId))

  const joined = sql`FROM case_results tr
    JOIN cases tc ON tc.id = tr.case_id
    LEFT JOIN cases fc ON fc.set_id = ${fr0.setId} AND fc.input_key = tc.input_key
    LEFT JOIN case_results fr ON fr.run_id = ${fromRun.id} AND fr.case_id = fc.id
    WHERE tr.run_id = ${toRun.id}`
  const kind = kindExpr()
  const [agg] = (await db.execute(sql`SELECT COUNT(fid) AS compared,
      COALESCE(SUM(k = 'newly-failing'), 0) AS newlyFailing, COALESCE(SUM(k = 'fixed'), 0) AS fixed,
      COALESCE(SUM(k = 'still-failing'), 0) AS stillFailing, COALESCE(SUM(k = 'worse'), 0) AS worse,
      COALESCE(SUM(k = 'better'), 0) AS better, COALESCE(SUM(k = 'new-case'), 0) AS onlyInTo
    FROM (SELECT fr.id AS fid, ${kind} AS k ${joined}) t`) as unknown as [Array<Record<string, unknown>>])[0]
  const [gone] = (await db.execute(sql`SELECT COUNT(*) AS n FROM cases fc
    WHERE fc.set_id = ${fr0.setId} AND NOT EXISTS (SELECT 1 FROM cases tc WHERE tc.set_id = ${tr0.setId} AND tc.input_key = fc.input_key)`) as unknown as [Array<{ n: number }>])[0]

  const filter = q.kind === 'all' ? sql`` : sql`HAVING kind = ${q.kind}`
  const sortCol = { change: sql`change_key`, from: sql`fr.rel_error_key`, to: sql`tr.rel_error_key`, case: sql`tc.ordinal` }[q.sort]
  const dir = q.dir === 'asc' ? sql`ASC` : sql`DESC`
  const [rows] = await db.execute(sql`SELECT tc.ordinal, tc.inputs, fr.verdict AS from_verdict, tr.verdict AS to_verdict,
      fr.rel_error AS from_rel, tr.rel_error AS to_rel, fr.rel_error_key AS from_key, tr.rel_error_key AS to_key,
      ${changeExpr} AS change_key, ${kind} AS kind
    ${joined} ${filter}
    ORDER BY ${sortCol} IS NULL, ${sortCol} ${dir}, tc.ordinal ASC
    LIMIT ${q.pageSize} OFFSET ${(q.page - 1) * q.pageSize}`) as unknown as [Array<Record<string, unknown>>]
  const [count] = (await db.execute(sql`SELECT COUNT(*) AS n FROM (SELECT ${kind} AS kind ${joined} ${filter}) t`) as unknown as [Array<{ n: number }>])[0]

  const n = (v: unknown) => Number(v ?? 0)
  const summary = {
    compared: n(agg?.compared), newlyFailing: n(agg?.newlyFailing), fixed: n(agg?.fixed), stillFailing: n(agg?.stillFailing),
    worse: n(agg?.worse), better: n(agg?.better), onlyInTo: n(agg?.onlyInTo), onlyInFrom: n(gone?.n),
    fromMaxRelError: fr0.maxRelError, toMaxRelError: tr0.maxRelError,
  }
  const short = (s: string | null) => (s === null ? '—' : Number(s) === 0 ? '0' : Number(s).toExponential(1))
  const line = `${code.name} ${q.to} against ${q.from} on ${set?.name ?? q.set}: ${summary.newlyFailing} newly failing, ${summary.fixed} fixed, ${summary.stillFailing} still failing`
    + `${summary.worse || summary.better ? `, ${summary.worse} worse and ${summary.better} better by more than ${WORSE_FACTOR}×` : ''}; worst relative error ${short(summary.fromMaxRelError)} → ${short(summary.toMaxRelError)}.`
  const key = (v: unknown) => (v === null || v === undefined ? null : Number(v))
  return {
    code: { slug: code.slug, name: code.name },
    set: { slug: q.set, name: set?.name ?? q.set },
    from: { label: q.from, runId: fromRun.id, revision: fromRun.revision },
    to: { label: q.to, runId: toRun.id, revision: toRun.revision },
    rule: COMPARE_RULE,
    summary: { ...summary, line },
    total: n(count?.n), page: q.page, pageSize: q.pageSize,
    rows: rows.map((r): CompareRow => {
      const fk = key(r.from_key)
      const tk = key(r.to_key)
      const ck = key(r.change_key)
      return {
        ordinal: n(r.ordinal), inputs: typeof r.inputs === 'string' ? JSON.parse(r.inputs) as Record<string, string> : r.inputs as Record<string, string> | null,
        fromVerdict: (r.from_verdict ?? null) as CompareRow['fromVerdict'], toVerdict: r.to_verdict as CompareRow['toVerdict'],
        fromRelError: (r.from_rel ?? null) as string | null, toRelError: (r.to_rel ?? null) as string | null,
        change: ck === null || ck >= 1e299 ? null : ck, ratio: fk && tk ? tk / fk : null, kind: r.kind as CompareRow['kind'],
      }
    }),
  }
}
