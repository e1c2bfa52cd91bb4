// Reading the board: the latest run of every version × reference-set slug,
// picked in SQL (one window query), so the server never loads every run.
import { sql } from 'drizzle-orm'
import type { Verdict } from '../../shared/domain/enums'

export type Counts = Partial<Record<Verdict, number>>

export interface LatestRun {
  id: number
  versionId: number
  setId: number
  slug: string
  revision: number
  counts: Counts
  isRegression: boolean
}

const json = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) as T : v as T)

/** The latest run (highest id) per version × set slug, for the given versions; optionally one slug only. */
export async function latestRuns(versionIds: number[], slug?: string): Promise<LatestRun[]> {
  if (!versionIds.length) return []
  // the window runs over narrow rows only: a JSON (text) column in it would
  // push MariaDB's temporary table to disk; counts join on afterwards by id
  const [rows] = await useDb().execute(sql`
    SELECT l.id, l.version_id, runs.set_id, l.slug, l.revision, l.is_regression, runs.counts FROM (
      SELECT r.id, r.version_id, s.slug, s.revision, r.is_regression,
             ROW_NUMBER() OVER (PARTITION BY r.version_id, s.slug ORDER BY r.id DESC) AS rn
      FROM runs r JOIN reference_sets s ON s.id = r.set_id
      WHERE r.version_id IN (${sql.join(versionIds.map(id => sql`${id}`), sql`, `)})
      ${slug ? sql`AND s.slug = ${slug}` : sql``}
    ) l JOIN runs ON runs.id = l.id WHERE l.rn = 1`) as unknown as [Array<Record<string, unknown>>]
  return rows.map(r => ({
    id: Number(r.id), versionId: Number(r.version_id), setId: Number(r.set_id), slug: String(r.slug), revision: Number(r.revision),
    counts: json<Counts>(r.counts), isRegression: Boolean(r.is_regression),
  }))
}
