import { idParamSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const admin = await requireRole(event, 'admin')
  await limitInvitationResends(event, id)
  return { sent: await resendInvitation(id, admin) }
})
