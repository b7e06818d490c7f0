import { receiptCheckSchema } from '#shared/schemas/ledger'

// Whether today's ledger still holds the head an old receipt signed.
export default defineEventHandler(async (event) => {
  const { receipt } = await readValidatedBody(event, zodValidator(receiptCheckSchema))
  await requireRole(event, 'auditor', 'lead', 'admin')
  return checkLedgerReceipt(receipt)
})
