import { idParamSchema } from '#shared/schemas/common'
import { approveSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(approveSchema))
  const { user } = await requireDecisionAccess(event, id, 'approve')
  return { decision: await approveDecision(id, body, user) }
})
