import { idParamSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, isMember } = await requireDecisionAccess(event, id)
  return decisionDetail(id, user, isMember)
})
