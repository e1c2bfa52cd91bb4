// Exports of a verification record (server/utils/verification-record.ts):
// JSON, CSV (cells made safe by csvCell) and JUnit XML with one test case per
// reference-set case, so a CI system can show it. XML is built by
// fast-xml-parser's builder, which escapes text and attributes.
import { XMLBuilder } from 'fast-xml-parser'
import { csvCell } from './csv'
import type { RunCaseRow } from '../../shared/domain/api-types'
import type { VerificationRecord } from '../../shared/domain/record-types'

type Cases = Map<string, RunCaseRow[]>

const inputsOf = (row: RunCaseRow, sep = ', ') => (row.inputs ? Object.entries(row.inputs).map(([k, v]) => `${k}=${v}`).join(sep) : '')

export function recordJson(record: VerificationRecord, cases: Cases) {
  return { ...record, cases: Object.fromEntries(cases) }
}

export function recordCsv(record: VerificationRecord, cases: Cases): string {
  const head = ['set', 'set_revision', 'run_id', 'line', 'inputs', 'region', 'measured', 'reference', 'reference_digits', 'abs_error', 'rel_error', 'ulps', 'digits_agreed', 'verdict', 'stored_verdict', 'accepted_by_deviation', 'decided_by']
  const lines = [
    `# Verification record: ${record.code.name} ${record.version.label}${record.version.commitId ? ` (${record.version.commitId})` : ''}, generated ${record.generatedAt}`,
    `# ${record.caution}`,
    head.join(','),
  ]
  for (const s of record.sets) {
    if (!s.run) {
      lines.push([s.slug, s.reference?.revision ?? '', '', '', '', '', '', '', '', '', '', '', '', 'not_run', '', '', s.required ? 'required set without a run on this version' : ''].map(v => csvCell(v)).join(','))
      continue
    }
    for (const c of cases.get(s.slug) ?? []) {
      lines.push([s.slug, s.run.set.revision, s.run.id, c.line, inputsOf(c, '; '), c.region, c.measured, c.reference, c.referenceDigits, c.absError, c.relError, c.ulps, c.digitsAgreed, c.verdict, c.storedVerdict, c.acceptedBy, c.decidedBy].map(v => csvCell(v)).join(','))
    }
  }
  return lines.join('\n') + '\n'
}

// XML 1.0 allows no control characters other than tab, newline and carriage return.
// eslint-disable-next-line no-control-regex
const xmlText = (v: unknown) => String(v ?? '').replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '\uFFFD')

function testCase(record: VerificationRecord, slug: string, c: RunCaseRow) {
  const name = c.inputs ? inputsOf(c) : `line ${c.line ?? '?'}`
  const tc: Record<string, unknown> = { '@_classname': xmlText(`${record.code.slug}.${slug}`), '@_name': xmlText(name), '@_time': '0' }
  const figures = `measured ${c.measured ?? '(none)'}; reference ${c.reference ?? '(none)'}; abs. error ${c.absError ?? '-'}; rel. error ${c.relError ?? '-'}; ULPs ${c.ulps ?? '-'}; line ${c.line ?? '-'}; region ${c.region ?? '-'}`
  if (c.verdict === 'accepted') {
    tc['system-out'] = xmlText(`accepted by deviation ${c.acceptedBy}: judged ${c.storedVerdict} (${c.decidedBy}); ${figures}`)
  }
  else if (c.verdict !== 'pass') {
    tc.failure = { '@_type': c.verdict, '@_message': xmlText(`${c.verdict.replace('_', '-')}: ${c.decidedBy}`), '#text': xmlText(figures) }
  }
  return tc
}

export function recordJunit(record: VerificationRecord, cases: Cases): string {
  const suites = record.sets.map((s) => {
    const props = [
      ['code', record.code.slug], ['version', record.version.label], ['commit', record.version.commitId],
      ['reference_set', s.slug], ['set_revision', s.reference?.revision ?? ''], ['source', s.reference?.source ?? ''],
      ['certified_digits', s.reference?.targetDigits ?? ''], ['criterion', JSON.stringify(s.reference?.criterion ?? null)],
      ['run_id', s.run?.id ?? ''], ['caution', record.caution],
    ].map(([name, value]) => ({ '@_name': name, '@_value': xmlText(value) }))
    if (!s.run) {
      return {
        '@_name': xmlText(`${record.code.slug} ${record.version.label} / ${s.slug}`), '@_tests': 1, '@_failures': s.required ? 1 : 0, '@_errors': 0, '@_skipped': s.required ? 0 : 1,
        'properties': { property: props },
        'testcase': [{ '@_classname': xmlText(`${record.code.slug}.${s.slug}`), '@_name': 'run on this version', '@_time': '0',
          ...(s.required ? { failure: { '@_type': 'not_run', '@_message': 'no run on this required reference set', '#text': 'Submit an output table for this set before signing the version.' } } : { skipped: { '@_message': 'no run' } }) }],
      }
    }
    const rows = cases.get(s.slug) ?? []
    return {
      '@_name': xmlText(`${record.code.slug} ${record.version.label} / ${s.slug} r${s.run.set.revision}`),
      '@_tests': rows.length, '@_failures': rows.filter(c => c.verdict !== 'pass' && c.verdict !== 'accepted').length, '@_errors': 0, '@_skipped': 0,
      '@_timestamp': s.run.createdAt.replace(/\.\d+Z$/, ''),
      'properties': { property: props },
      'testcase': rows.map(c => testCase(record, s.slug, c)),
    }
  })
  const builder = new XMLBuilder({ ignoreAttributes: false, attributeNamePrefix: '@_', format: true, suppressEmptyNode: true })
  const doc = {
    '?xml': { '@_version': '1.0', '@_encoding': 'UTF-8' },
    'testsuites': {
      '@_name': xmlText(`Plumbline verification record: ${record.code.name} ${record.version.label}`),
      '@_tests': suites.reduce((n, s) => n + Number(s['@_tests']), 0),
      '@_failures': suites.reduce((n, s) => n + Number(s['@_failures']), 0),
      '@_errors': 0,
      'testsuite': suites,
    },
  }
  return builder.build(doc) as string
}
