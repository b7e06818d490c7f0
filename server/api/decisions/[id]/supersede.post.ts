import { idParamSchema } from '#shared/schemas/common'
import { supersedeSchema } from '#shared/schemas/decisions'

// Answers with the new draft that replaces the closed decision.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(supersedeSchema))
  const { user } = await requireDecisionAccess(event, id, 'supersede')
  const decision = await supersedeDecision(id, body, user)
  setResponseStatus(event, 201)
  return { decision }
})
