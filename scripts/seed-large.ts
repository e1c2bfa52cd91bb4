// The load scenario for the board: 50 invented codes × 30 versions × 10
// reference sets with a run in (nearly) every cell, bulk-inserted. Every name
// says "load scenario"; none of it is a real code or a real result. Runs carry
// counts and summary figures, and four case results each (the sets have four
// cases with exact integer reference values), so a run page opens normally.
// Called by `tsx scripts/seed.ts --large`; skipped when it is already there.
import { createHash } from 'node:crypto'
import { eq, inArray, sql } from 'drizzle-orm'
import mysql from 'mysql2'
import type { Db } from '../server/database/client'
import * as s from '../server/database/schema'

export const LOAD = { codes: 50, versions: 30, sets: 10 }

// H_n(1) for n = 1…4 from H_0 = 1, H_1 = 2x, H_{n+1} = 2x H_n − 2n H_{n−1} (DLMF 18.9.1): exact integers.
const CASES = [['1', '2'], ['2', '2'], ['3', '-4'], ['4', '-20']] as const

const pad = (i: number) => String(i + 1).padStart(2, '0')
const hex = (text: string, n = 12) => createHash('sha256').update(text).digest('hex').slice(0, n)

// a small deterministic generator, so every seeded load scenario is the same
function prng(seed: number) {
  let t = seed >>> 0
  return () => {
    t = (t + 0x6D2B79F5) >>> 0
    let r = Math.imul(t ^ (t >>> 15), 1 | t)
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296
  }
}

async function bulk(db: Db, table: string, columns: string[], rows: unknown[][], batch = 2000) {
  for (let i = 0; i < rows.length; i += batch) {
    await db.execute(sql.raw(mysql.format(`INSERT INTO ${table} (${columns.join(', ')}) VALUES ?`, [rows.slice(i, i + batch) as mysql.SqlValue[][]])))
  }
}

export async function seedLarge(db: Db, ownerId: number | null): Promise<{ runs: number } | null> {
  const [already] = await db.select({ id: s.codes.id }).from(s.codes).where(eq(s.codes.slug, 'load-code-01'))
  if (already) return null
  const rnd = prng(20261202)

  await db.insert(s.teams).values({ slug: 'load-scenario', name: 'Load scenario (invented, for the board benchmark)' }).onDuplicateKeyUpdate({ set: { slug: 'load-scenario' } })
  const [team] = await db.select({ id: s.teams.id }).from(s.teams).where(eq(s.teams.slug, 'load-scenario'))
  const codeRows = Array.from({ length: LOAD.codes }, (_, i) => ({
    slug: `load-code-${pad(i)}`, name: `Load code ${pad(i)}`, teamId: team!.id, language: 'invented',
    description: 'Invented code of the load scenario (board benchmark); its versions and runs are generated, not real results.',
  }))
  await db.insert(s.codes).values(codeRows)
  const codes = await db.select({ id: s.codes.id, slug: s.codes.slug }).from(s.codes).where(inArray(s.codes.slug, codeRows.map(c => c.slug)))
  if (ownerId) await db.insert(s.codeOwners).values(codes.filter((_, i) => i % 5 === 0).map(c => ({ codeId: c.id, userId: ownerId })))

  const env = (i: number): s.BuildEnvironment => ({ compiler: i % 2 ? 'gfortran 13.2' : 'clang 18', flags: '-O2', platform: 'x86_64-linux', floatFormat: 'binary64', libraries: { 'load-scenario-lib': `0.${i}` } })
  await db.insert(s.versions).values(codes.flatMap(c => Array.from({ length: LOAD.versions }, (_, v) => ({
    codeId: c.id, label: `1.${v}.0`, commitId: hex(`${c.slug}:${v}`), environment: env(v),
  }))))
  const versions = await db.select({ id: s.versions.id, codeId: s.versions.codeId, label: s.versions.label }).from(s.versions).where(inArray(s.versions.codeId, codes.map(c => c.id)))
  const versionId = new Map(versions.map(v => [`${v.codeId}:${v.label}`, v.id]))

  // ten sets; the last has a second revision, so runs on its first are stale
  const setDef = (i: number, revision: number) => ({
    slug: `load-set-${pad(i)}`, revision, name: `Load set ${pad(i)}`, functionId: 'hermite', convention: 'physicists, H_n',
    grid: { parts: [{ kind: 'points', points: CASES.map(([n]) => ({ n, x: '1' })) }] }, targetDigits: 20,
    criterion: { format: 'binary64', tolerance: { kind: 'ulps', maxUlps: '4' }, regions: [], zero: { below: '1e-300', atol: '1e-300' }, overflow: { signedInf: 'pass' } },
    source: 'Load scenario (invented): H_n(1) for n = 1…4, exact integers from the three-term recurrence (DLMF 18.9.1)',
    state: 'ready' as const, caseCount: CASES.length, casesDone: CASES.length, frozenAt: new Date(),
  })
  await db.insert(s.referenceSets).values([...Array.from({ length: LOAD.sets }, (_, i) => setDef(i, 1)), setDef(LOAD.sets - 1, 2)])
  const sets = await db.select({ id: s.referenceSets.id, slug: s.referenceSets.slug, revision: s.referenceSets.revision }).from(s.referenceSets).where(sql`${s.referenceSets.slug} LIKE 'load-set-%'`)
  await bulk(db, 'cases', ['set_id', 'ordinal', 'inputs', 'input_key', 'reference_value', 'certified_digits', 'region', 'certification'],
    sets.flatMap(set => CASES.map(([n, value], k) => [set.id, k, JSON.stringify({ n, x: '1' }), `n=${n};x=1`, value, 20, 'all', 'exact integer (load scenario)'])))
  const cases = await db.select({ id: s.cases.id, setId: s.cases.setId, ordinal: s.cases.ordinal }).from(s.cases).where(inArray(s.cases.setId, sets.map(x => x.id)))
  const caseId = new Map(cases.map(c => [`${c.setId}:${c.ordinal}`, c.id]))

  const [{ next }] = (await db.execute(sql`SELECT COALESCE(MAX(id), 0) + 1 AS next FROM runs`) as unknown as [[{ next: number }]])[0]
  let runId = Number(next)
  const runRows: unknown[][] = []
  const fileRows: unknown[][] = []
  const resultRows: unknown[][] = []
  for (const c of codes) {
    for (let si = 0; si < LOAD.sets; si++) {
      let before = 0
      for (let v = 0; v < LOAD.versions; v++) {
        // the newest versions are not yet verified everywhere
        if (v >= LOAD.versions - 2 && rnd() < 0.4) continue
        const slug = `load-set-${pad(si)}`
        const set = sets.find(x => x.slug === slug && x.revision === (si === LOAD.sets - 1 && v >= 25 ? 2 : 1))!
        const failing = rnd() < 0.12 ? 1 + Math.floor(rnd() * 3) : 0
        const counts = failing ? { pass: CASES.length - failing, fail: failing } : { pass: CASES.length }
        const max = failing ? `${(1 + rnd() * 8).toFixed(3)}e-${6 + Math.floor(rnd() * 4)}` : `${(1 + rnd() * 8).toFixed(3)}e-${15 + Math.floor(rnd() * 2)}`
        const median = `${(1 + rnd() * 8).toFixed(3)}e-${16 + Math.floor(rnd() * 2)}`
        const content = `# load scenario (invented) ${c.slug} 1.${v}.0 ${slug}\nn,x,H\n${CASES.map(([n, val], k) => `${n},1,${k < failing ? `${val}.000001` : val}`).join('\n')}\n`
        const figures = { total: CASES.length, counts, maxRelError: max, medianRelError: median, rmsRelError: max, maxUlps: failing ? '4503599627' : '1' }
        runRows.push([runId, versionId.get(`${c.id}:1.${v}.0`), set.id, 'load-scenario.csv', createHash('sha256').update(content).digest('hex'), content.length,
          JSON.stringify({ n: 'n', x: 'x', value: 'H' }), JSON.stringify(counts), max, median, max, figures.maxUlps,
          JSON.stringify({ overall: { ...figures, worst: null }, regions: { all: { ...figures, worst: null } } }), failing > before ? 1 : 0])
        fileRows.push([runId, content])
        CASES.forEach(([, value], k) => {
          const bad = k < failing
          resultRows.push([runId, caseId.get(`${set.id}:${k}`), 3 + k, bad ? `${value}.000001` : value, bad ? '0.000001' : '0', bad ? max : '0', bad ? figures.maxUlps : '0',
            bad ? '6' : '17', 'all', bad ? Number(max) : 0, bad ? 1e-6 : 0, bad ? Number(figures.maxUlps) : 0, bad ? 'fail' : 'pass', 'ulps'])
        })
        before = failing
        runId++
      }
    }
  }
  await bulk(db, 'runs', ['id', 'version_id', 'set_id', 'file_name', 'file_sha256', 'file_size', 'column_mapping', 'counts', 'max_rel_error', 'median_rel_error', 'rms_rel_error', 'max_ulps', 'regions', 'is_regression'], runRows)
  await bulk(db, 'run_files', ['run_id', 'content'], fileRows)
  await bulk(db, 'case_results', ['run_id', 'case_id', 'line_number', 'measured', 'abs_error', 'rel_error', 'ulps', 'digits_agreed', 'region', 'rel_error_key', 'abs_error_key', 'ulps_key', 'verdict', 'decided_by'], resultRows, 5000)
  await db.insert(s.auditLog).values({ actor: 'seed', action: 'seed-load-scenario', objectType: 'registry', objectId: 'load', detail: { ...LOAD, runs: runRows.length } })
  return { runs: runRows.length }
}
