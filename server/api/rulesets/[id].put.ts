import { rulesetParamSchema, rulesetUpdateSchema } from '#shared/schemas/rulesets'

// A draft's rules (and base scores, version, note). 409 for a published or retired version; 400
// naming each invalid rule and the reason.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireRole(event, 'lead', 'admin')
  const body = await readValidatedBody(event, zodValidator(rulesetUpdateSchema))
  return { ruleset: await updateRulesetDraft(id, body, user) }
})
