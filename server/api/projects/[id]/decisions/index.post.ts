import { idParamSchema } from '#shared/schemas/common'
import { decisionCreateSchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(decisionCreateSchema))
  const { user, project } = await requireProjectMember(event, id)
  const decision = await createDecision(project, body, user)
  setResponseStatus(event, 201)
  return { decision }
})
