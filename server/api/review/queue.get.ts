export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'reviewer')
  return { decisions: await reviewQueueFor(user) }
})
