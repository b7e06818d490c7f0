import { idParamSchema } from '#shared/schemas/common'
import { projectUpdateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(projectUpdateSchema))
  await requireRole(event, 'admin')
  return { project: await updateProject(id, body) }
})
