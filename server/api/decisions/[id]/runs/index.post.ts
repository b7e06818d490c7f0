import { idParamSchema } from '#shared/schemas/common'
import { runRecordSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const body = await readValidatedBody(event, zodValidator(runRecordSchema))
  const { user } = await requireVerificationAccess(event, id, 'record')
  setResponseStatus(event, 201)
  return { run: await createRunRecord(id, body, user) }
})
