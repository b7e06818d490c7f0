// The background full verification's progress or result, and the last full run on record.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'auditor', 'lead')
  return fullLedgerVerificationStatus()
})
