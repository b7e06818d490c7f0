import { rulesetCreateSchema } from '#shared/schemas/rulesets'

// A new draft: a copy of the published version (or of the one named by `from`, which rolls back to
// it), or an imported file checked like any draft.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'lead', 'admin')
  const body = await readValidatedBody(event, zodValidator(rulesetCreateSchema))
  const ruleset = await createRulesetDraft(body, user)
  setResponseStatus(event, 201)
  return { ruleset }
})
