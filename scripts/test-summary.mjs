// Prints the one closing line CI reads: `N passed, N failed` (and skipped, if any).
import { readFileSync } from 'node:fs'

const file = process.argv[2] ?? 'test-results/vitest.json'
let report
try {
  report = JSON.parse(readFileSync(file, 'utf8'))
}
catch (e) {
  console.log('0 passed, 1 failed')
  console.error(`no test report at ${file}: ${e.message}`)
  process.exit(1)
}
const files = report.testResults ?? []
// A file that failed to load has no failed test of its own; count it as one failure.
const brokenFiles = files.filter(f => f.status === 'failed' && !(f.assertionResults ?? []).some(a => a.status === 'failed')).length
const passed = report.numPassedTests ?? 0
const failed = (report.numFailedTests ?? 0) + brokenFiles
const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0)

console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`)
process.exit(failed > 0 || passed === 0 ? 1 : 0)
