import { adoptCalibrationSchema } from '#shared/schemas/verification'

export default defineEventHandler(async (event) => {
  const { note } = await readValidatedBody(event, zodValidator(adoptCalibrationSchema))
  const user = await requireRole(event, 'lead')
  setResponseStatus(event, 201)
  return { adoption: await adoptCalibration(note, user) }
})
