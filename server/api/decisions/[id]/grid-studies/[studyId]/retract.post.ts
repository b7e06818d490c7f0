import { gridStudyParamsSchema, retractSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id, studyId } = await getValidatedRouterParams(event, zodValidator(gridStudyParamsSchema))
  const { reason } = await readValidatedBody(event, zodValidator(retractSchema))
  const { user } = await requireVerificationAccess(event, id, 'retract')
  return { verification: await retractRecord('grid-study', id, studyId, reason, user) }
})
