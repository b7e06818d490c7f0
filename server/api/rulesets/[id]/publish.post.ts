import { publishSchema, rulesetParamSchema } from '#shared/schemas/rulesets'

// Publication: the draft becomes the version new advice uses, the previous one retires, and the
// ruleset history records the publisher and the change note. 409 while a canonical case fails.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireRole(event, 'lead', 'admin')
  const { note } = await readValidatedBody(event, zodValidator(publishSchema))
  return { ruleset: await publishRulesetDraft(id, note, user) }
})
