import { revisionParamsSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id, n } = await getValidatedRouterParams(event, zodValidator(revisionParamsSchema))
  await requireDecisionAccess(event, id)
  return { revision: await readRevision(id, n) }
})
