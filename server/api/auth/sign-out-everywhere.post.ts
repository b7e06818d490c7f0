// Ends every session of the signed-in user on every device (a lost laptop, a shared computer),
// this one included.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  await endAllSessions(user.id)
  await clearUserSession(event)
  return { ok: true }
})
