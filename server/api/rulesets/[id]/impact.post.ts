import { impactRequestSchema, rulesetParamSchema } from '#shared/schemas/rulesets'

// Which past decisions would change approach, model or wall treatment under this version, against
// the published one: { evaluated, changes } at once for a small set, else 202 with a job to poll.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(rulesetParamSchema))
  const user = await requireRole(event, 'lead', 'admin')
  const request = await readValidatedBody(event, zodValidator(impactRequestSchema))
  const outcome = await previewImpact(await requireRulesetRow(id, user), request, user)
  if (outcome.job) {
    setResponseStatus(event, 202)
    return { job: jobSummary(outcome.job) }
  }
  return outcome.result
})
