// The record's CSV and JUnit XML from a hand-made record: text that XML must
// escape (and control characters it cannot carry) comes back intact through
// a general-purpose XML parser; CSV cells that a spreadsheet would run as
// formulas are defused.
import { XMLParser, XMLValidator } from 'fast-xml-parser'
import { describe, expect, it } from 'vitest'
import { recordCsv, recordJunit } from '../../../server/utils/record-exports'
import type { RunCaseRow, RunDetail } from '../../../shared/domain/api-types'
import type { VerificationRecord } from '../../../shared/domain/record-types'

const row = (over: Partial<RunCaseRow>): RunCaseRow => ({
  id: 1, line: 2, inputs: { n: '4', x: '0.5' }, region: 'all', measured: '-5', reference: '-5', referenceDigits: 20, kappa: null,
  absError: '0', relError: '0', ulps: '0', digitsAgreed: '20', verdict: 'pass', decidedBy: 'ulps', storedVerdict: 'pass', acceptedBy: null, ...over,
})

const record = {
  generatedAt: '2026-12-02T00:00:00.000Z',
  caution: 'A verdict is evidence, not a substitute for a QA programme.',
  code: { slug: 'oscillite', name: 'Oscillite <&> "quoted"', team: 't', description: 'd', language: 'Fortran' },
  version: { id: 1, label: '2.4.1', commitId: 'c7d2', environment: {}, createdAt: '2026-12-01T00:00:00.000Z' },
  requiredSets: ['a-set', 'b-set'],
  missingRequired: ['b-set'],
  sets: [
    { slug: 'a-set', required: true, reference: { id: 1, revision: 2, currentRevision: 2, name: 'A', functionId: 'hermite', convention: 'physicists', output: 'value', source: 'DLMF 18.3 & A&S 22.12 <tables>', targetDigits: 20, criterion: { tolerance: { kind: 'ulps', maxUlps: '4' } }, caseCount: 3, frozenAt: null, definition: {} as never },
      run: { id: 7, createdAt: '2026-12-01T10:00:00.000Z', set: { revision: 2 } } as unknown as RunDetail, failures: [], failureCount: 2 },
    { slug: 'b-set', required: true, reference: null, run: null, failures: [], failureCount: 0 },
  ],
  deviations: [],
  signOffs: [],
} satisfies VerificationRecord

const cases = new Map([['a-set', [
  row({ id: 1 }),
  row({ id: 2, inputs: { n: '8', x: '1' }, verdict: 'accepted', storedVerdict: 'fail', acceptedBy: 12, decidedBy: 'ulps > 4' }),
  row({ id: 3, inputs: null, line: 9, measured: '=HYPERLINK("x")\u0007', verdict: 'unexpected', storedVerdict: 'unexpected', decidedBy: 'no case <with> these inputs' }),
]]])

describe('JUnit XML of a record', () => {
  const xml = recordJunit(record, cases)
  const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: n => ['testsuite', 'testcase', 'property'].includes(n) }).parse(xml)

  it('is well-formed XML whose escaped text reads back as written', () => {
    expect(XMLValidator.validate(xml)).toBe(true)
    expect(parsed.testsuites.name).toBe('Plumbline verification record: Oscillite <&> "quoted" 2.4.1')
    const props = Object.fromEntries(parsed.testsuites.testsuite[0].properties.property.map((p: { name: string, value: string }) => [p.name, p.value]))
    expect(props.source).toBe('DLMF 18.3 & A&S 22.12 <tables>')
  })

  it('has one test case per case, failures as <failure>, accepted ones noted, control characters replaced', () => {
    const [a, b] = parsed.testsuites.testsuite
    expect(a.testcase.map((t: { name: string }) => t.name)).toEqual(['n=4, x=0.5', 'n=8, x=1', 'line 9'])
    expect(a.testcase[0].failure).toBeUndefined()
    expect(a.testcase[1]['system-out']).toMatch(/^accepted by deviation 12: judged fail \(ulps > 4\)/)
    expect(a.testcase[2].failure).toMatchObject({ type: 'unexpected', message: 'unexpected: no case <with> these inputs' })
    expect(a.testcase[2].failure['#text']).toContain('measured =HYPERLINK("x")\uFFFD')
    expect(a.failures).toBe('1')
    expect(b.testcase[0]).toMatchObject({ name: 'run on this version', failure: { type: 'not_run' } })
    expect(parsed.testsuites.tests).toBe('4')
  })
})

describe('CSV of a record', () => {
  it('writes the caution, one row per case, a row for a required set without a run, and defuses formulas', () => {
    const lines = recordCsv(record, cases).trim().split('\n')
    expect(lines[1]).toBe(`# ${record.caution}`)
    expect(lines).toHaveLength(3 + 3 + 1)
    expect(lines[4]).toContain(',accepted,fail,12,')
    expect(lines[5]).toContain(',"\'=HYPERLINK(""x"")\u0007",')
    expect(lines[6]).toMatch(/^b-set,,,,,,,,,,,,,not_run,,,required set without a run on this version$/)
  })
})
