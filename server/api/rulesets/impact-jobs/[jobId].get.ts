import { jobParamSchema } from '#shared/schemas/rulesets'

// An impact preview running in the background: its progress, and its result once done.
export default defineEventHandler(async (event) => {
  const { jobId } = await getValidatedRouterParams(event, zodValidator(jobParamSchema))
  await requireRole(event, 'lead', 'admin')
  return { job: jobSummary(findImpactJob(jobId)) }
})
