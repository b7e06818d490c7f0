import { auditListQuerySchema } from '#shared/schemas/audit'

// Every decision across projects with its history and chain check, a keyset page at a time:
// ?cursor=&limit=&projectId=&status=&q= -> { items, nextCursor, total, totalIsEstimate }.
export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(auditListQuerySchema))
  await requireRole(event, 'auditor', 'lead')
  if (query.projectId) await requireProjectRead(event, query.projectId)
  return listAuditDecisions(query)
})
