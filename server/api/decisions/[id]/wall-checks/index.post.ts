import { idParamSchema } from '#shared/schemas/common'
import { wallCheckFieldsSchema } from '#shared/schemas/verification'
import { MAX_UPLOAD_BYTES } from '#shared/verification'

// Upload of a solver's wall export (multipart, field "file"; optional yPlusColumn, areaColumn,
// patchColumn). Guarded before the body is read; the file is parsed before anything is kept.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user } = await requireVerificationAccess(event, id, 'record')
  const upload = await receiveUpload(event, { fileField: 'file', maxBytes: MAX_UPLOAD_BYTES, fields: ['yPlusColumn', 'areaColumn', 'patchColumn'] })
  try {
    if (!upload.file) throw createError({ statusCode: 400, message: 'No file was sent: put the wall export in the form field "file"' })
    const fields = zodValidator(wallCheckFieldsSchema)(upload.fields)
    const wallCheck = await createWallCheck(id, upload.file, fields, user)
    setResponseStatus(event, 201)
    return { wallCheck }
  } finally {
    await upload.cleanup()
  }
})
