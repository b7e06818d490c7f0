import { auditFilterSchema } from '#shared/schemas/audit'

// The whole audit list (same filters and search, every row) as a CSV download, streamed.
export default defineEventHandler(async (event) => {
  const filter = await getValidatedQuery(event, zodValidator(auditFilterSchema))
  await requireRole(event, 'auditor', 'lead')
  if (filter.projectId) await requireProjectRead(event, filter.projectId)
  setResponseHeaders(event, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': `attachment; filename="${auditCsvFilename()}"`,
    'cache-control': 'no-store',
  })
  return sendStream(event, streamAuditCsv(event, filter))
})
