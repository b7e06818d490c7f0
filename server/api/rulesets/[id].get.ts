import { rulesetParamSchema } from '#shared/schemas/rulesets'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireUser(event)
  return { ruleset: await readRuleset(await requireRulesetRow(id, user)) }
})
