import { rulesetParamSchema } from '#shared/schemas/rulesets'

// A draft may be discarded; a released version is kept for good.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireRole(event, 'lead', 'admin')
  await deleteRulesetDraft(id, user)
  return { deleted: id }
})
