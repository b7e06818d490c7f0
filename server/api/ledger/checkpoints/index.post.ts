// A checkpoint now: the head signed, the receipt mailed to the auditors and returned.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'auditor', 'admin')
  const checkpoint = await signLedgerCheckpoint('request')
  setResponseStatus(event, 201)
  return { checkpoint: checkpointDto(checkpoint!) }
})
