import { reviewQueueQuerySchema } from '#shared/schemas/review'

// The reviewer's queue, a page at a time: ?cursor=&limit= -> { items, nextCursor, total, totalIsEstimate }.
export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(reviewQueueQuerySchema))
  const user = await requireRole(event, 'reviewer')
  return reviewQueueFor(user, query)
})
