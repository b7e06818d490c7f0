import { projectCreateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, zodValidator(projectCreateSchema))
  await requireRole(event, 'admin')
  setResponseStatus(event, 201)
  return { project: await createProject(body) }
})
