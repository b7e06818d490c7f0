import { idParamSchema } from '#shared/schemas/common'
import { gridStudySchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(gridStudySchema))
  const { user } = await requireVerificationAccess(event, id, 'record')
  setResponseStatus(event, 201)
  return { gridStudy: await createGridStudy(id, body, user) }
})
