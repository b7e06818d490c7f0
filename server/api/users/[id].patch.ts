import { idParamSchema } from '#shared/schemas/common'
import { userUpdateSchema } from '#shared/schemas/users'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(userUpdateSchema))
  const admin = await requireRole(event, 'admin')
  return { user: await updateUser(id, body, admin.id) }
})
