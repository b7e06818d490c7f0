import { wallCheckParamsSchema, wallCheckReviewSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id, checkId } = await getValidatedRouterParams(event, zodValidator(wallCheckParamsSchema))
  const body = await readValidatedBody(event, zodValidator(wallCheckReviewSchema))
  const { user } = await requireVerificationAccess(event, id, 'review')
  return { wallCheck: await reviewWallCheck(id, checkId, body, user) }
})
