import { z } from 'zod'
import { parseTable, suggestColumnMapping } from '../../../shared/parse'
import type { TablePreview } from '../../../shared/domain/api-types'

const fields = z.object({ setId: z.coerce.number().int().positive({ error: 'Choose a reference set.' }) })

// What the parser sees in a table, and a first guess at the column mapping, before anything is judged or stored.
export default defineEventHandler(async (event): Promise<TablePreview> => {
  await requireRole(event, 'qa', 'admin')
  const upload = await readUpload(event)
  const { setId } = parseOr400(fields, upload.fields, 'upload')
  const set = await loadSet(setId)
  const table = parseTable(upload.data)
  if (table.errors.some(e => e.kind === 'too-large')) throw httpError(413, 'too_large', table.errors[0]!.message)
  const params = parameterNames(set.functionId)
  const guess = suggestColumnMapping(table.columns, params).mapping
  return {
    format: table.format,
    encoding: table.encoding,
    columns: table.columns,
    rows: table.rows.slice(0, 12).map(r => ({ line: r.line, fields: r.fields.map(f => f.raw) })),
    rowCount: table.rows.length,
    mapping: Object.fromEntries(Object.entries(guess).filter(([, v]) => v !== undefined)) as Record<string, string>,
    errors: table.errors.map(e => ({ line: e.line, column: e.column, field: e.field, message: e.message })),
    errorCount: table.errorCount,
  }
})
