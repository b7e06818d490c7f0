import { auditFilterSchema } from '#shared/schemas/audit'

// The whole audit list (same filters, every row) as a CSV download.
export default defineEventHandler(async (event) => {
  const filter = await getValidatedQuery(event, zodValidator(auditFilterSchema))
  await requireRole(event, 'auditor', 'lead')
  if (filter.projectId) await requireProjectRead(event, filter.projectId)
  const csv = await auditCsv(filter)
  setResponseHeaders(event, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': `attachment; filename="${auditCsvFilename()}"`,
    'cache-control': 'no-store',
  })
  return csv
})
