import { idParamSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireRole(event, 'admin')
  return { mail: await retryMail(id) }
})
