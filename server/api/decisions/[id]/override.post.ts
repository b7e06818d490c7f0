import { idParamSchema } from '#shared/schemas/common'
import { overrideSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(overrideSchema))
  const { user } = await requireDecisionAccess(event, id, 'override')
  return { decision: await overrideDecision(id, body, user) }
})
