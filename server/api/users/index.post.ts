import { userCreateSchema } from '#shared/schemas/users'

export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, zodValidator(userCreateSchema))
  const admin = await requireRole(event, 'admin')
  setResponseStatus(event, 201)
  return { user: await createUser(body, admin) }
})
