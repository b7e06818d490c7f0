import { overviewQuerySchema } from '#shared/schemas/overview'

// The team lead's overview across projects (or one): method usage, overrides and compute.
export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(overviewQuerySchema))
  await requireRole(event, 'lead', 'auditor')
  if (query.projectId) await requireProjectRead(event, query.projectId)
  return decisionOverview(query)
})
