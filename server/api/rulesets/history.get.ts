// The ruleset history (installations and publications with their publisher and note) and its
// hash-chain check.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  return rulesetHistory()
})
