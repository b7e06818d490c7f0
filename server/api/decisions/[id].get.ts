import type { ApproachId } from '#shared/rules'
import { idParamSchema } from '#shared/schemas/common'

// The decision page in three queries: the session's user, the decision with its guard, its history.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, found } = await requireDecisionRead(event, id)
  const { detail, calibrationInForce } = await decisionDetail(found, user)
  // Both estimates, the engine's and the team-calibrated one, for the approach that stands.
  const focus = (detail.decision.override?.approach ?? detail.decision.advice.recommendation.approach) as ApproachId
  return { ...detail, calibration: await calibrationFor(detail.decision.advice, focus, calibrationInForce) }
})
