// Who may do what to a decision, in which status: pure, so the routes' guards and the page's
// permissions come from one table-tested function (tests/unit/server/utils/decisions/policy.spec.ts).
import { DECISION_STATUS_LABELS, type DecisionStatus } from '#shared/utils/decision-status'
import { MEMBER_ROLES, ROLE_LABELS, type Role } from '#shared/utils/roles'
import type { SessionUser } from '#shared/types/session'

export type DecisionAction = 'revise' | 'submit' | 'approve' | 'override' | 'request-changes' | 'supersede' | 'comment'
export type Refusal = { statusCode: 403 | 409; message: string }
/** What the policy needs to know of a decision. */
export type DecisionState = { authorId: number; status: DecisionStatus }

// Auditors and leads read every project's decisions; administrators manage accounts and projects
// but are not given decision contents.
const READS_ALL_DECISIONS: readonly Role[] = ['auditor', 'lead']

export const statusWord = (status: DecisionStatus) => DECISION_STATUS_LABELS[status].toLowerCase()

export function readsDecisions(user: SessionUser, isMember: boolean) {
  return READS_ALL_DECISIONS.includes(user.role) || (MEMBER_ROLES.includes(user.role) && isMember)
}

export function decisionReadRefusal(user: SessionUser, isMember: boolean): Refusal | null {
  if (readsDecisions(user, isMember)) return null
  if (user.role === 'admin') {
    return { statusCode: 403, message: 'Administrators manage accounts and projects; decisions are read by project members, auditors and leads' }
  }
  return { statusCode: 403, message: 'You are not a member of this project' }
}

const REVIEW_VERBS: Partial<Record<DecisionAction, string>> = {
  approve: 'approved',
  override: 'overridden',
  'request-changes': 'sent back for changes',
}

/**
 * Why a user may not take an action on a decision (403 for who they are, 409 for the state the
 * decision is in), or null when they may. The route guards and the permissions shown on the
 * decision page both come from here.
 */
export function decisionRefusal(
  user: SessionUser,
  decision: DecisionState,
  isMember: boolean,
  action: DecisionAction,
): Refusal | null {
  const read = decisionReadRefusal(user, isMember)
  if (read) return read
  if (!MEMBER_ROLES.includes(user.role) || !isMember) {
    return { statusCode: 403, message: `${ROLE_LABELS[user.role]}s read decisions; only engineers and reviewers of the project act on them` }
  }
  const own = decision.authorId === user.id
  const status = decision.status
  switch (action) {
    case 'revise':
    case 'submit': {
      const doing = action === 'revise' ? 'revise' : 'submit'
      if (!own) return { statusCode: 403, message: `Only the author may ${doing} this decision` }
      if (status !== 'draft') {
        return { statusCode: 409, message: `Only a draft can be ${doing === 'revise' ? 'revised' : 'submitted'}; this decision is ${statusWord(status)}` }
      }
      return null
    }
    case 'approve':
    case 'override':
    case 'request-changes':
      if (user.role !== 'reviewer') return { statusCode: 403, message: 'Only a senior reviewer can approve, override or send back a decision' }
      if (own) return { statusCode: 403, message: 'Nobody reviews their own decision: another reviewer of the project must' }
      if (status !== 'in_review') {
        return { statusCode: 409, message: `Only a decision in review can be ${REVIEW_VERBS[action]}; this one is ${statusWord(status)}` }
      }
      return null
    case 'supersede':
      if (status !== 'approved' && status !== 'overridden') {
        return { statusCode: 409, message: `Only an approved or overridden decision can be superseded; this one is ${statusWord(status)}` }
      }
      return null
    case 'comment':
      return null
  }
}

export function decisionPermissions(user: SessionUser, decision: DecisionState, isMember: boolean) {
  const may = (action: DecisionAction) => decisionRefusal(user, decision, isMember, action) === null
  return {
    canRevise: may('revise'),
    canSubmit: may('submit'),
    canReview: may('approve'),
    canSupersede: may('supersede'),
    canComment: may('comment'),
  }
}
