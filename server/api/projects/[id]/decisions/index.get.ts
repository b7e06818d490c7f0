import { idParamSchema } from '#shared/schemas/common'
import { decisionListQuerySchema } from '#shared/schemas/decisions'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const query = await getValidatedQuery(event, zodValidator(decisionListQuerySchema))
  await requireProjectDecisions(event, id)
  return listProjectDecisions(id, query)
})
