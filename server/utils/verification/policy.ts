// Who may do what with a decision's verification records: pure, so the guards and the page's
// permissions come from one table-tested function (tests/unit/server/utils/verification/policy.spec.ts).
import { MEMBER_ROLES } from '#shared/utils/roles'
import type { SessionUser } from '#shared/types/session'
import { decisionReadRefusal } from '../decisions/policy'

// The author and the project's engineers record and retract; the project's reviewers accept or
// reject wall checks (never their own upload); auditors and leads read. Records go on signed-off
// decisions only.

export type VerificationAction = 'record' | 'retract' | 'review'
type Refusal = { statusCode: 403 | 409; message: string }
type DecisionFacts = { authorId: number; status: string }

const SIGNED_OFF = ['approved', 'overridden']

export function verificationRefusal(user: SessionUser, decision: DecisionFacts, isMember: boolean, action: VerificationAction): Refusal | null {
  const read = decisionReadRefusal(user, isMember)
  if (read) return read
  if (!MEMBER_ROLES.includes(user.role) || !isMember) {
    return { statusCode: 403, message: 'Auditors and leads read verification records; the project\'s engineers and reviewers add and judge them' }
  }
  if (action === 'review') {
    if (user.role !== 'reviewer') return { statusCode: 403, message: 'Only a senior reviewer of the project accepts or rejects a wall check' }
    return null
  }
  if (user.role !== 'engineer' && decision.authorId !== user.id) {
    return { statusCode: 403, message: 'The author and the project\'s engineers record verification; reviewers accept or reject it' }
  }
  if (action === 'record' && !SIGNED_OFF.includes(decision.status)) {
    return { statusCode: 409, message: `Verification is recorded on a signed-off decision (approved or overridden); this one is ${decision.status.replace('_', ' ')}` }
  }
  return null
}

export function verificationPermissions(user: SessionUser, decision: DecisionFacts, isMember: boolean) {
  return {
    canRecord: verificationRefusal(user, decision, isMember, 'record') === null,
    canRetract: verificationRefusal(user, decision, isMember, 'retract') === null,
    canReview: verificationRefusal(user, decision, isMember, 'review') === null,
  }
}
