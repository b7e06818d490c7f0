import { adviceRequestSchema } from '#shared/schemas/decisions'

// A preview: the engine's advice for a case under the published ruleset, nothing saved; with the
// team-calibrated estimate beside the engine's when a calibration has been adopted.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { caseInput } = await readValidatedBody(event, zodValidator(adviceRequestSchema))
  const advice = adviceFor(caseInput, await publishedRuleset())
  return { advice, calibration: await calibrationFor(advice) }
})
