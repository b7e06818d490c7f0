import { mailListQuerySchema } from '#shared/schemas/mail'

export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(mailListQuerySchema))
  await requireRole(event, 'admin')
  return listOutbox(query)
})
