// Starts a full verification (every entry and record recomputed) in the background.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'auditor', 'lead')
  const { run, started } = startFullLedgerVerification(user)
  setResponseStatus(event, started ? 202 : 200)
  return { run, started }
})
