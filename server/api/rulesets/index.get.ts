// Every ruleset version, newest first: leads and admins see drafts too; every signed-in role reads
// the published and retired versions (saved decisions name them).
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return { rulesets: await listRulesets(user) }
})
