import { recordExportQuery, versionParams } from '../../../../../../../shared/schemas/sign-off'

// The verification record as a file: JSON, CSV or JUnit XML, every case of every run listed.
export default defineEventHandler(async (event) => {
  // people of any role, or a read token of this code (CI shows the record too)
  const caller = await requireAccess(event, { roles: ANY_ROLE, scopes: ['read'] })
  const { slug, label } = validParams(event, versionParams)
  requireCodeAccess(caller, (await findCode(slug)).id)
  const user = caller.user
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
