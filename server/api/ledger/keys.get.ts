// The public keys that verify checkpoints: the active one and the retired ones.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'auditor', 'lead', 'admin')
  return listLedgerKeys()
})
