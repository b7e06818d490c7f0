import { idParamSchema } from '#shared/schemas/common'

// The decision's PDF record, for QA to file; readable by whoever may read the decision.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireDecisionAccess(event, id)
  const data = await loadDecisionReport(id)
  const pdf = await renderDecisionReport(data)
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-disposition': `attachment; filename="${decisionReportFilename(data)}"`,
    'cache-control': 'private, no-store',
  })
  return pdf
})
