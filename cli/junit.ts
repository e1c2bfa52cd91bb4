/**
 * A run as JUnit XML: one <testsuite> per run, one <testcase> per case. Cases
 * that pass or are accepted by a deviation pass; every other verdict is a
 * <failure> whose type is the verdict.
 */
import { create } from 'xmlbuilder2'

export interface JunitCase {
  line: number | null
  inputs: Record<string, string> | null
  region: string | null
  measured: string | null
  reference: string | null
  relError: string | null
  ulps: string | null
  digitsAgreed: string | null
  verdict: string
  decidedBy: string
}

export interface JunitRun {
  id: number
  url: string
  code: string
  version: string
  set: { slug: string, revision: number, name: string }
  createdAt: string
  fileSha256: string
}

export const CAUTION = 'A verdict is evidence for a verification record; it does not replace your organisation\'s QA programme, local codes or licensed review.'

const PASSING = new Set(['pass', 'accepted'])

export function caseName(c: JunitCase): string {
  const inputs = c.inputs ? Object.entries(c.inputs).map(([k, v]) => `${k}=${v}`).join(' ') : ''
  if (c.verdict === 'unexpected') return `line ${c.line ?? '?'}: ${inputs || 'row'} (not in the set)`
  return inputs || `line ${c.line ?? '?'}`
}

function detail(c: JunitCase): string {
  return [
    `verdict: ${c.verdict} (decided by ${c.decidedBy})`,
    c.line !== null ? `line: ${c.line}` : 'line: none (the table has no row for this case)',
    `measured: ${c.measured ?? '—'}`,
    `reference: ${c.reference ?? '—'}`,
    `relative error: ${c.relError ?? '—'}`,
    `ULPs: ${c.ulps ?? '—'}`,
    `digits agreed: ${c.digitsAgreed ?? '—'}`,
  ].join('\n')
}

export function runToJunit(run: JunitRun, cases: JunitCase[]): string {
  const failures = cases.filter(c => !PASSING.has(c.verdict)).length
  const suiteName = `${run.code} ${run.version} · ${run.set.slug} r${run.set.revision}`
  const doc = create({ version: '1.0', encoding: 'UTF-8' })
  const root = doc.ele('testsuites', { name: 'plumbline', tests: cases.length, failures, errors: 0 })
  const suite = root.ele('testsuite', { name: suiteName, tests: cases.length, failures, errors: 0, skipped: 0, timestamp: run.createdAt })
  const props = suite.ele('properties')
  for (const [name, value] of [['run', String(run.id)], ['url', run.url], ['set', run.set.name], ['sha256', run.fileSha256], ['caution', CAUTION]] as const) {
    props.ele('property', { name, value })
  }
  const classname = `plumbline.${run.code}.${run.set.slug}.r${run.set.revision}`
  for (const c of cases) {
    const tc = suite.ele('testcase', { classname: c.region && c.region !== 'all' ? `${classname}.${c.region}` : classname, name: caseName(c) })
    if (!PASSING.has(c.verdict)) tc.ele('failure', { type: c.verdict, message: `${c.verdict}: ${c.relError ? `relative error ${c.relError}` : c.decidedBy}` }).txt(detail(c))
    else if (c.verdict === 'accepted') tc.ele('system-out').txt(`accepted by a deviation\n${detail(c)}`)
  }
  suite.ele('system-out').txt(`Run ${run.id}: ${run.url}\n${CAUTION}`)
  return doc.end({ prettyPrint: true }) + '\n'
}
