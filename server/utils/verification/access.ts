import type { H3Event } from 'h3'
import { requireDecisionAccess } from '../auth/guards'
import { verificationRefusal, type VerificationAction } from './policy'

// The guard of the verification routes: the decision's own read access, then the policy.

/** 404 for a missing decision, 403/409 from the rules above; 'read' as for the decision itself. */
export async function requireVerificationAccess(event: H3Event, decisionId: number, action: VerificationAction | 'read') {
  const access = await requireDecisionAccess(event, decisionId)
  if (action !== 'read') {
    const refusal = verificationRefusal(access.user, access.decision, access.isMember, action)
    if (refusal) throw createError(refusal)
  }
  return access
}
