import { wallCheckParamsSchema } from '#shared/schemas/verification'

// The bytes that were uploaded, as stored, for whoever may read the decision.
export default defineEventHandler(async (event) => {
  const { id, checkId } = await getValidatedRouterParams(event, zodValidator(wallCheckParamsSchema))
  await requireVerificationAccess(event, id, 'read')
  const check = await findWallCheck(id, checkId)
  const { body, size } = await getObjectStream(check.storageKey)
  setResponseHeaders(event, {
    'content-type': check.compressed ? 'application/gzip' : 'text/csv; charset=utf-8',
    'content-disposition': `attachment; filename="${check.fileName.replace(/[^\w.-]+/g, '_')}"`,
    'cache-control': 'private, no-store',
    'x-content-sha256': check.sha256,
    ...(size !== undefined ? { 'content-length': size } : {}),
  })
  return sendStream(event, body)
})
