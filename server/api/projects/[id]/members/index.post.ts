import { idParamSchema } from '#shared/schemas/common'
import { memberAddSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { userId } = await readValidatedBody(event, zodValidator(memberAddSchema))
  await requireRole(event, 'admin')
  setResponseStatus(event, 201)
  return { members: await addMember(id, userId) }
})
