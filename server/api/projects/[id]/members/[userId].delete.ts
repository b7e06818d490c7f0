import { memberParamsSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const { id, userId } = await getValidatedRouterParams(event, zodValidator(memberParamsSchema))
  await requireRole(event, 'admin')
  return { members: await removeMember(id, userId) }
})
