import { rulesetParamSchema } from '#shared/schemas/rulesets'

// The version as a JSON file (the engine's shape and its canonical cases), to import elsewhere.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireUser(event)
  const row = await requireRulesetRow(id, user)
  setResponseHeader(event, 'content-disposition', `attachment; filename="ruleset-${row.key}-${row.version}${row.status === 'draft' ? '-draft' : ''}.json"`)
  return exportRuleset(row)
})
