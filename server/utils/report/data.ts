// What the PDF record shows, read once so that the document is one consistent state.
import { verifyChain } from '../decisions/events'
import { listEvents, projectHeading, readDecision, readRevision } from '../decisions/queries'
import { useDb } from '../db'
import { verificationSection } from '../verification/records'

/** Everything the record shows, read once so that the PDF is one consistent state. */
export async function loadDecisionReport(decisionId: number) {
  const decision = await readDecision(decisionId)
  const signedOff = decision.status === 'approved' || decision.status === 'overridden' || decision.status === 'superseded'
  const [project, events, chain, revision, verification] = await Promise.all([
    projectHeading(decision.projectId),
    listEvents(decisionId),
    verifyChain(useDb(), decisionId),
    readRevision(decisionId, decision.revision),
    signedOff ? verificationSection(decisionId) : null,
  ])
  return {
    decision,
    project,
    events,
    chain,
    verification,
    provenance: { rulesetId: revision.rulesetId, rulesetVersion: revision.rulesetVersion, engineVersion: revision.engineVersion, inputHash: revision.inputHash },
  }
}
export type DecisionReportData = Awaited<ReturnType<typeof loadDecisionReport>>

export function decisionReportFilename(data: Pick<DecisionReportData, 'decision' | 'project'>) {
  const code = data.project.code.replace(/[^A-Za-z0-9_-]+/g, '_')
  return `eddyledger-${code}-decision-${data.decision.id}-v${data.decision.version}.pdf`
}
