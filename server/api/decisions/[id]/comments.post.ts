import { idParamSchema } from '#shared/schemas/common'
import { decisionCommentSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { comment } = await readValidatedBody(event, zodValidator(decisionCommentSchema))
  const { user } = await requireDecisionAccess(event, id, 'comment')
  return { decision: await commentOnDecision(id, comment, user) }
})
