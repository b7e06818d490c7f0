// The whole ledger verified now (incrementally from the last clean, signed run), by kind of problem.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'auditor', 'lead')
  return ledgerReportDto(await runLedgerVerification('incremental'))
})
