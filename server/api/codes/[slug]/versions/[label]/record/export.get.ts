import { recordExportQuery, versionParams } from '../../../../../../../shared/schemas/sign-off'

// The verification record as a file: JSON, CSV or JUnit XML, every case of every run listed.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ...ANY_ROLE)
  const { slug, label } = validParams(event, versionParams)
  const { format } = validQuery(event, recordExportQuery)
  const record = await buildRecord(user, slug, label, 0)
  const cases = await recordCases(record)
  const name = `verification-record-${slug}-${label}`
  if (format === 'json') {
    setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.json"`)
    return recordJson(record, cases)
  }
  if (format === 'csv') {
    setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
    setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.csv"`)
    return recordCsv(record, cases)
  }
  setResponseHeader(event, 'content-type', 'application/xml; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${name}.junit.xml"`)
  return recordJunit(record, cases)
})
