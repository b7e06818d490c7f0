import { describe, expect, it } from 'vitest'
import { verificationRefusal, type VerificationAction } from '../../../../../server/utils/verification/policy'
import type { SessionUser } from '#shared/types/session'

// The verification policy as a table: who records, retracts and reviews, on which decision.
const person = (id: number, role: SessionUser['role']): SessionUser => ({ id, role, name: role, email: `${role}${id}@eddyledger.test` })
const ENGINEER = person(1, 'engineer')
const OTHER_ENGINEER = person(2, 'engineer')
const REVIEWER = person(3, 'reviewer')
const AUDITOR = person(4, 'auditor')
const LEAD = person(5, 'lead')
const ADMIN = person(6, 'admin')

type Row = [string, SessionUser, { authorId: number; status: string }, boolean, VerificationAction, number | null]
const approved = { authorId: 1, status: 'approved' }
const reviewerAuthored = { authorId: 3, status: 'overridden' }
const draft = { authorId: 1, status: 'draft' }
const superseded = { authorId: 1, status: 'superseded' }

const TABLE: Row[] = [
  ['the author records', ENGINEER, approved, true, 'record', null],
  ['an engineer member records', OTHER_ENGINEER, approved, true, 'record', null],
  ['an engineer who is not a member does not', OTHER_ENGINEER, approved, false, 'record', 403],
  ['a reviewer member does not record', REVIEWER, approved, true, 'record', 403],
  ['a reviewer who authored the decision records', REVIEWER, reviewerAuthored, true, 'record', null],
  ['auditors read only', AUDITOR, approved, false, 'record', 403],
  ['leads read only', LEAD, approved, false, 'record', 403],
  ['administrators do not read decisions', ADMIN, approved, false, 'record', 403],
  ['nothing is recorded on a draft', ENGINEER, draft, true, 'record', 409],
  ['nothing new on a superseded decision', ENGINEER, superseded, true, 'record', 409],
  ['a wrong record is retracted on a superseded decision too', ENGINEER, superseded, true, 'retract', null],
  ['a reviewer member reviews', REVIEWER, approved, true, 'review', null],
  ['an engineer does not review', ENGINEER, approved, true, 'review', 403],
  ['a lead does not review', LEAD, approved, false, 'review', 403],
]

describe('verification policy', () => {
  it.each(TABLE)('%s', (_name, user, decision, isMember, action, expected) => {
    const refusal = verificationRefusal(user, decision, isMember, action)
    expect(refusal?.statusCode ?? null).toBe(expected)
  })
})
