import { idParamSchema } from '#shared/schemas/common'
import { requestChangesSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(requestChangesSchema))
  const { user } = await requireDecisionAccess(event, id, 'request-changes')
  return { decision: await requestChanges(id, body, user) }
})
