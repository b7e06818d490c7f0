import { idParamSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { project } = await requireProjectRead(event, id)
  return { project, members: await listMembers(id) }
})
