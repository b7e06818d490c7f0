import { passFractionSchema } from '#shared/schemas/verification'

// The team's pass fraction for wall y+ checks; each change is kept (append-only).
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, zodValidator(passFractionSchema))
  const user = await requireRole(event, 'lead')
  return { settings: await setPassFraction(body.wallCheckPassFraction, body.note, user) }
})
