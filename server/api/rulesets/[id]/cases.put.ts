import { casesUpdateSchema, rulesetParamSchema } from '#shared/schemas/rulesets'

// A draft's canonical cases, replaced as a whole; 409 for a released version.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireRole(event, 'lead', 'admin')
  const { cases } = await readValidatedBody(event, zodValidator(casesUpdateSchema))
  const checked = await replaceRulesetCases(id, cases, user)
  return { cases: checked, passing: checked.every(item => item.passes) }
})
