// Creating and revising a decision: a transaction around the record's steps, with the server's
// refusals (archived project, stale version).
import type { DecisionCreateBody, DecisionReviseBody } from '#shared/schemas/decisions'
import { badRequest, conflict, notFound } from '../http/errors'
import type { DecisionStatus } from '#shared/utils/decision-status'
import type { SessionUser } from '#shared/types/session'
import type { DbOrTx } from '../../db/types'
import { statusWord } from './policy'
import { findDecision, readDecision } from './queries'
import { insertDecision, RequestedChoiceError, reviseDecisionRecord } from './record'
import { useDb } from '../db'
import { publishedRuleset } from '../rulesets/rulesets'

/**
 * After a conditional update matched nothing: say why, from the decision as it is now. A stale
 * version is the usual reason (someone acted first); else its status no longer allows the action.
 */
export async function throwConflict(db: DbOrTx, decisionId: number, version: number, allowed: readonly DecisionStatus[], doing: string): Promise<never> {
  const row = await findDecision(decisionId, db)
  if (!row) throw notFound(`Decision ${decisionId} does not exist`)
  if (row.version !== version) {
    throw conflict(`This decision has changed since you loaded it (it is at version ${row.version}, you sent ${version}); reload it and try again`)
  }
  throw conflict(`Only a decision that is ${allowed.map(statusWord).join(' or ')} can be ${doing}; this one is ${statusWord(row.status)}`)
}

/** A requested choice the engine's advice cannot take, as a 400 at its field. */
function refusedChoice(error: unknown): never {
  if (error instanceof RequestedChoiceError) throw badRequest(error.message, { [`requested.${error.field}`]: [error.message] })
  throw error
}

export async function createDecision(project: { id: number; code: string; archived: boolean }, body: DecisionCreateBody, user: SessionUser) {
  if (project.archived) throw conflict(`Project ${project.code} is archived; it takes no new decisions`)
  return useDb().transaction(async (tx) => {
    const decision = await insertDecision(tx, {
      projectId: project.id, title: body.title, notes: body.notes, author: user,
      caseInput: body.caseInput, unitSystem: body.unitSystem, entered: body.entered, requested: body.requested,
      ruleset: await publishedRuleset(tx),
    }).catch(refusedChoice)
    return readDecision(decision.id, tx)
  })
}

export async function reviseDecision(decisionId: number, body: DecisionReviseBody, user: SessionUser) {
  return useDb().transaction(async (tx) => {
    const row = await reviseDecisionRecord(tx, {
      decisionId, version: body.version, notes: body.notes, title: body.title, actor: user,
      caseInput: body.caseInput, unitSystem: body.unitSystem, entered: body.entered, requested: body.requested,
      ruleset: await publishedRuleset(tx),
    }).catch(refusedChoice)
    if (!row) await throwConflict(tx, decisionId, body.version, ['draft'], 'revised')
    return readDecision(decisionId, tx)
  })
}
