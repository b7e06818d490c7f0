import { idParamSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireDecisionAccess(event, id)
  return { events: await listEvents(id) }
})
