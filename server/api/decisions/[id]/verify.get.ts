import { idParamSchema } from '#shared/schemas/common'

// Recomputes the decision's hash chain from the stored events.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireDecisionAccess(event, id)
  return verifyChain(useDb(), id)
})
