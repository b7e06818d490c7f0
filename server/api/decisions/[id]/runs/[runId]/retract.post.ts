import { retractSchema, runParamsSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id, runId } = await getValidatedRouterParams(event, zodValidator(runParamsSchema))
  const { reason } = await readValidatedBody(event, zodValidator(retractSchema))
  const { user } = await requireVerificationAccess(event, id, 'retract')
  return { verification: await retractRecord('run', id, runId, reason, user) }
})
