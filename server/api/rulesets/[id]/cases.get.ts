import { rulesetParamSchema } from '#shared/schemas/rulesets'

// The version's canonical cases, each with what the version recommends for it.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireUser(event)
  const cases = await rulesetCases(await requireRulesetRow(id, user))
  return { cases, passing: cases.every(item => item.passes) }
})
