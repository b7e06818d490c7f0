// Who may do what to a decision in which status, as a table: the same function sets the page's
// permissions and the routes' refusals (403 for who you are, 409 for the decision's state).
import { describe, expect, it } from 'vitest'
import type { SessionUser } from '#shared/types/session'
import type { DecisionStatus } from '#shared/utils/decision-status'
import { decisionPermissions, decisionReadRefusal, decisionRefusal, type DecisionAction } from '../../../../../server/utils/decisions/policy'

const AUTHOR: SessionUser = { id: 1, email: 'a@x.test', name: 'Author', role: 'engineer' }
const actors = {
  author: { user: AUTHOR, member: true },
  engineer: { user: { ...AUTHOR, id: 2, role: 'engineer' }, member: true },
  reviewer: { user: { ...AUTHOR, id: 3, role: 'reviewer' }, member: true },
  outsideReviewer: { user: { ...AUTHOR, id: 4, role: 'reviewer' }, member: false },
  auditor: { user: { ...AUTHOR, id: 5, role: 'auditor' }, member: false },
  lead: { user: { ...AUTHOR, id: 6, role: 'lead' }, member: false },
  admin: { user: { ...AUTHOR, id: 7, role: 'admin' }, member: true },
} satisfies Record<string, { user: SessionUser; member: boolean }>
type Actor = keyof typeof actors

// [actor, action, status, expected status code or null when allowed]
const TABLE: [Actor, DecisionAction, DecisionStatus, 403 | 409 | null][] = [
  ['author', 'revise', 'draft', null],
  ['author', 'revise', 'in_review', 409],
  ['author', 'submit', 'draft', null],
  ['author', 'submit', 'approved', 409],
  ['engineer', 'revise', 'draft', 403],
  ['engineer', 'submit', 'draft', 403],
  ['reviewer', 'approve', 'in_review', null],
  ['reviewer', 'override', 'in_review', null],
  ['reviewer', 'request-changes', 'in_review', null],
  ['reviewer', 'approve', 'draft', 409],
  ['reviewer', 'override', 'approved', 409],
  ['engineer', 'approve', 'in_review', 403],
  ['author', 'approve', 'in_review', 403],
  ['outsideReviewer', 'approve', 'in_review', 403],
  ['author', 'supersede', 'approved', null],
  ['engineer', 'supersede', 'overridden', null],
  ['reviewer', 'supersede', 'overridden', null],
  ['author', 'supersede', 'draft', 409],
  ['author', 'supersede', 'superseded', 409],
  ['engineer', 'comment', 'superseded', null],
  ['reviewer', 'comment', 'draft', null],
  ['auditor', 'comment', 'approved', 403],
  ['lead', 'supersede', 'approved', 403],
  ['admin', 'comment', 'draft', 403],
  ['outsideReviewer', 'comment', 'draft', 403],
]

describe('decisionRefusal', () => {
  it.each(TABLE)('%s %s on a %s decision -> %s', (actor, action, status, expected) => {
    const { user, member } = actors[actor]
    const refusal = decisionRefusal(user, { authorId: AUTHOR.id, status }, member, action)
    expect(refusal?.statusCode ?? null).toBe(expected)
    if (refusal) expect(refusal.message.length).toBeGreaterThan(10)
  })
})

describe('decisionReadRefusal', () => {
  it.each([
    ['author', null], ['reviewer', null], ['auditor', null], ['lead', null], ['outsideReviewer', 403], ['admin', 403],
  ] as [Actor, 403 | null][])('%s reading -> %s', (actor, expected) => {
    const { user, member } = actors[actor]
    expect(decisionReadRefusal(user, member)?.statusCode ?? null).toBe(expected)
  })

  it('tells an administrator who reads decisions instead', () => {
    expect(decisionReadRefusal(actors.admin.user, true)?.message).toMatch(/auditors and leads/)
  })
})

describe('decisionPermissions', () => {
  it('gives the page the same answers as the guards', () => {
    const { user, member } = actors.reviewer
    expect(decisionPermissions(user, { authorId: AUTHOR.id, status: 'in_review' }, member)).toEqual({
      canRevise: false, canSubmit: false, canReview: true, canSupersede: false, canComment: true,
    })
    expect(decisionPermissions(actors.author.user, { authorId: AUTHOR.id, status: 'draft' }, true)).toEqual({
      canRevise: true, canSubmit: true, canReview: false, canSupersede: false, canComment: true,
    })
  })
})
