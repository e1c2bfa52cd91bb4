/**
 * Judging a code's output against a reference set: criteria, regions,
 * per-case verdicts, row matching and run summaries. Pure TypeScript.
 */
export { judgeCase, type CaseJudgement, type CaseVerdict, type JudgeOptions, type MeasuredKind, type MeasuredValue, type ReferenceValue } from './judge'
export { compileCriterion, regionOf, checkCriterionDigits, checkReferenceSettles, digitsNeededFor, type CompiledCriterion, type SettleIssue } from './criterion'
export { matchRows, type MatchResult } from './match'
export { summarizeRun, type Figures, type RunCaseResult, type RunSummary, type WorstCase } from './summary'
export { DEFAULT_REGION, RegionError } from './regions'
export { parseExpression, expressionNames, ExpressionError, type Expr } from './expression'
export { referenceFromOutput } from './reference'
export { judgeRun, judgeRunInChunks, rowsOf, type RunCase, type RunResult, type RunRow, type RunRows } from './run'
