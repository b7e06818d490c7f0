import { auditListQuerySchema } from '#shared/schemas/audit'

// Every decision across projects with its history and chain check, a page at a time.
export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(auditListQuerySchema))
  await requireRole(event, 'auditor', 'lead')
  if (query.projectId) await requireProjectRead(event, query.projectId)
  return listAuditDecisions(query)
})
