import { checkpointParamSchema } from '#shared/schemas/ledger'

// One checkpoint's receipt as a text file to keep.
export default defineEventHandler(async (event) => {
  const { number } = await getValidatedRouterParams(event, zodValidator(checkpointParamSchema))
  await requireRole(event, 'auditor', 'lead', 'admin')
  const { filename, text } = await ledgerReceiptFile(number)
  setResponseHeader(event, 'content-type', 'text/plain; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${filename}"`)
  return text
})
