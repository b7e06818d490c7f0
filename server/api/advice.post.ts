// A preview: the engine's advice for a case under the published ruleset, nothing saved; with the
// team-calibrated estimate beside the engine's when a calibration has been adopted. No query of its
// own: the versions come with the session check (server/utils/advice/basis.ts).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const caseInput = await readAdviceCase(event)
  const basis = await adviceBasis(event)
  setResponseHeader(event, 'content-type', 'application/json')
  return adviceAnswerJson(caseInput, basis)
})
