// The team's measured cost per cell-step, its runs across projects, and the adoptions: for leads
// and auditors, who read every project.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'lead', 'auditor')
  return calibrationOverview()
})
