import { advise } from '#shared/rules'
import { adviceRequestSchema } from '#shared/schemas/decisions'

// A preview: the engine's advice for a case, nothing saved.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { caseInput } = await readValidatedBody(event, zodValidator(adviceRequestSchema))
  return { advice: advise(caseInput) }
})
