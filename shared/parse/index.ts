/**
 * The tolerant table parser: solver output tables (CSV, TSV, whitespace
 * columns, JSON) → columns and exactly read fields. See README.md here for
 * the accepted formats and spellings.
 */
export { parseTable } from './table'
export { parseNumber, isNumericKind } from './number'
export { suggestColumnMapping, type ColumnMapping } from './mapping'
export { MAX_TABLE_BYTES, MAX_TABLE_ROWS, MAX_LISTED_ERRORS } from './types'
export type {
  Field, FieldKind, IssueKind, NumberReading, ParseIssue, ParseOptions, ParsedTable, Row, TableFormat, TextEncoding,
} from './types'
