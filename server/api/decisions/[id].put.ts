import { idParamSchema } from '#shared/schemas/common'
import { decisionReviseSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(decisionReviseSchema))
  const { user } = await requireDecisionAccess(event, id, 'revise')
  return { decision: await reviseDecision(id, body, user) }
})
