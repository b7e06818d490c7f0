import { idParamSchema } from '#shared/schemas/common'

// The decision re-evaluated under today's engine and published ruleset; the record is unchanged.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireDecisionAccess(event, id)
  return { reevaluation: await reevaluateDecision(id) }
})
