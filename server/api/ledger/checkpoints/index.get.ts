import { checkpointListQuerySchema } from '#shared/schemas/ledger'

// The signed checkpoints, newest first, each with its receipt; the ledger's head and the schedule.
export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(checkpointListQuerySchema))
  await requireRole(event, 'auditor', 'lead', 'admin')
  return ledgerCheckpointPage(query.page, query.pageSize)
})
