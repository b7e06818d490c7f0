// The calibration in force (figures only, no project detail), for every signed-in role: the
// browser's live estimate shows it beside the engine's.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  return { adopted: await adoptedCalibration() }
})
