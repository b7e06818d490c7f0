import { retractSchema, wallCheckParamsSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id, checkId } = await getValidatedRouterParams(event, zodValidator(wallCheckParamsSchema))
  const { reason } = await readValidatedBody(event, zodValidator(retractSchema))
  const { user } = await requireVerificationAccess(event, id, 'retract')
  return { verification: await retractRecord('wall-check', id, checkId, reason, user) }
})
