import { and, desc, eq, inArray } from 'drizzle-orm'
import type { ApproachId, WallTreatment } from '#shared/rules'
import { tables, useDb, type DbOrTx } from '../db'
import { readDecision } from '../decisions/queries'

/**
 * What was signed off: the reviewer's choice when overridden, else the engine's recommendation;
 * with the boundary-layer thickness in wall units that sets the wall-model band.
 */
export async function signedOffChoice(decisionId: number, db: DbOrTx = useDb()) {
  const decision = await readDecision(decisionId, db)
  const o = decision.override
  const choice = o
    ? { approach: o.approach as ApproachId, model: o.model, wallTreatment: o.wallTreatment as WallTreatment, yPlusTarget: o.yPlusTarget, deltaPlus: o.wall.deltaPlus, roughnessPlus: o.wall.roughnessPlus ?? null, by: 'override' as const }
    : { ...decision.advice.recommendation, deltaPlus: decision.advice.wall.deltaPlus, roughnessPlus: decision.advice.wall.roughnessPlus ?? null, by: 'recommendation' as const }
  return { decision, choice }
}

/** The reviewer who signed the decision off (the actor of its last approval or override), if still active. */
export async function signingReviewer(decisionId: number, db: DbOrTx = useDb()) {
  const e = tables.decisionEvents
  const [row] = await db.select({ id: tables.users.id, name: tables.users.name, email: tables.users.email, active: tables.users.active })
    .from(e).innerJoin(tables.users, eq(tables.users.id, e.actorId))
    .where(and(eq(e.decisionId, decisionId), inArray(e.type, ['approved', 'overridden'])))
    .orderBy(desc(e.seq)).limit(1)
  return row && row.active ? row : null
}
