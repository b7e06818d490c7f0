// The version new advice uses, for any signed-in role (the browser's live estimate runs it).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  return { ruleset: await readRuleset(await publishedRulesetRow()) }
})
