import { idParamSchema } from '#shared/schemas/common'
import { submitSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { version } = await readValidatedBody(event, zodValidator(submitSchema))
  const { user } = await requireDecisionAccess(event, id, 'submit')
  return { decision: await submitDecision(id, version, user) }
})
