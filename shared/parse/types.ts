/**
 * Shapes shared by the table parser. Pure data: no Vue, no Nitro.
 */

/** Uploads larger than this are refused before decoding (the server answers 413). */
export const MAX_TABLE_BYTES = 50 * 1024 * 1024
/** Twice the largest reference set (shared/schemas/reference-set.ts MAX_CASES): more rows than this cannot be an honest table, and would cost the server memory for nothing. */
export const MAX_TABLE_ROWS = 400_000

/** At most this many issues are listed; `errorCount` still counts them all. */
export const MAX_LISTED_ERRORS = 50

export type TableFormat = 'csv' | 'tsv' | 'whitespace' | 'json'

export type TextEncoding = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252'

/**
 * What a field holds.
 * - number: a finite value; `value` is its canonical exact decimal.
 * - inf, nan: IEEE 754 infinities and NaNs, with `sign`.
 * - overflowed: a Fortran field filled with asterisks (the value did not fit).
 * - empty: nothing between the delimiters, or JSON null.
 * - text: anything else (a label, or a number that could not be read).
 */
export type FieldKind = 'number' | 'inf' | 'nan' | 'overflowed' | 'empty' | 'text'

/** One reading of a field's text. */
export interface NumberReading {
  kind: FieldKind
  /**
   * For kind 'number' only: the exact value in normalised scientific form,
   * `[-]d[.ddd]e<exp>` with no trailing zeros in the digits and a plain
   * decimal exponent (`-1.5e3`, `2.5e-5`, `1e0`), or `0` for zero. Parseable
   * by decimal.js and by `parseExactDecimal` in shared/numeric/exact.ts.
   */
  value?: string
  /** For number, inf and nan: the sign as written (so `-0.0` keeps −1). */
  sign?: 1 | -1
  /** Why the text is not a number, for kind 'text' that looked numeric. */
  problem?: string
}

export interface Field extends NumberReading {
  /** The field's text as written: quotes removed, surrounding blanks trimmed. */
  raw: string
  /** 1-based line where the field starts. */
  line: number
  /** 1-based character position (UTF-16 code unit) of the field in its line. */
  column: number
}

export interface Row {
  /** 1-based line where the row starts. */
  line: number
  fields: Field[]
}

export type IssueKind =
  | 'too-large'
  | 'encoding'
  | 'syntax'
  | 'field-count'
  | 'not-a-number'
  | 'no-data'
  | 'missing-column'

export interface ParseIssue {
  kind: IssueKind
  /** 1-based; 0 when the issue concerns the whole file. */
  line: number
  /** 1-based character position in the line; 0 when not tied to a field. */
  column: number
  /** The column name the issue belongs to, when there is one. */
  field?: string
  /** A plain sentence a person can act on. */
  message: string
}

export interface ParseOptions {
  /** Force a format instead of detecting it. */
  format?: TableFormat
  /** Force a delimiter for csv (',' ';' '|' …); implies format 'csv' unless format says 'tsv'. */
  delimiter?: string
  /** true: the first data line is a header; false: there is none; unset: detect. */
  header?: boolean
  /**
   * Columns (by name) that must hold numbers; any other text in them is an
   * error. Unset: a column is numeric when most of its non-empty fields are.
   */
  numericColumns?: string[]
}

export interface ParsedTable {
  format: TableFormat | 'unknown'
  /** The delimiter used for csv and tsv; ' ' for whitespace; '' for json. */
  delimiter: string
  encoding: TextEncoding | 'unknown'
  bom: boolean
  /** Whether column names came from the file (a header line, a commented header, JSON keys). */
  headerFound: boolean
  columns: string[]
  /** Which columns were treated as numeric (parallel to `columns`). */
  numeric: boolean[]
  rows: Row[]
  /** The first MAX_LISTED_ERRORS issues, in file order. Any issue means: refuse the file. */
  errors: ParseIssue[]
  errorCount: number
}
