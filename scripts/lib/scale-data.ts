// The scale seed's data: years of Kestrel Bay Flow Consulting's work (projects, staff, and each
// decision's lifecycle) as the rows the record's own steps write (server/utils/decisions/record.ts):
// the same revision values, event payloads, override record and hash chain, built in memory so
// they can be inserted in bulk.
import { MODELS_BY_APPROACH, TURBULENCE_APPROACH_IDS, WALL_TREATMENTS_BY_APPROACH, type CaseInputDraft } from '../../shared/rules'
import type { Role } from '../../shared/utils/roles'
import type { DecisionStatus } from '../../shared/utils/decision-status'
import { GENESIS_HASH, eventHash, type DecisionEventType, type HashedFields } from '../../server/db/event-chain'
import type * as schema from '../../server/db/schema'
import { CONDENSER_WAKE, DATA_HALL_DUCT, FERRY_HULL, PUMP_INTAKE } from '../../server/db/seed-demo'
import { adviceRecord, overrideRecord, revisionPayload, revisionValues } from '../../server/utils/decisions/record'

export type Person = { id: number; name: string; role: Role }

/** A small deterministic generator (mulberry32), so a seed run can be repeated exactly. */
export function random(seed: number) {
  let state = seed >>> 0
  const next = () => {
    state = (state + 0x6D2B79F5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  return {
    next,
    pick: <T>(list: readonly T[]) => list[Math.floor(next() * list.length)]!,
    between: (low: number, high: number) => low + (high - low) * next(),
    // Log-uniform: a factor of `spread` either way around `value`.
    around: (value: number, spread: number) => value * spread ** (2 * next() - 1),
  }
}
export type Random = ReturnType<typeof random>

/** Kinds of work the consultancy takes on: a case family, a title stem and client names. */
export const WORK_KINDS = [
  { subject: 'Hull resistance', base: FERRY_HULL, parts: ['bare hull', 'with appendages', 'trim variant', 'ballast draught'] },
  { subject: 'Supply duct', base: DATA_HALL_DUCT, parts: ['main run', 'branch take-off', 'riser', 'plenum inlet'] },
  { subject: 'Condenser wake', base: CONDENSER_WAKE, parts: ['east facade', 'twin units', 'screened unit', 'roof edge'] },
  { subject: 'Intake swirl', base: PUMP_INTAKE, parts: ['low water level', 'pump 1 of 3', 'with baffle', 'design flow'] },
  { subject: 'Fan housing noise', base: { ...CONDENSER_WAKE, length: 0.4, velocity: 18 }, parts: ['inlet ring', 'volute tongue', 'guard grille'] },
  { subject: 'Heat exchanger header', base: { ...DATA_HALL_DUCT, length: 0.15, velocity: 3, fluid: { medium: 'water' as const, temperatureK: 320 } }, parts: ['inlet header', 'tube bank entry'] },
] as const satisfies readonly { subject: string; base: CaseInputDraft; parts: readonly string[] }[]

const CLIENTS = ['Saltmarsh Ferry Company', 'Gridline Hosting', 'Marlow Street Developments', 'Fenwater Utilities',
  'Northpoint Cold Stores', 'Tidewell Marine', 'Quarry Lane Energy', 'Brightwater Process', 'Harcourt Rail', 'Elm Reach Hospital Trust']

export function scaleProject(index: number, rng: Random) {
  const kind = WORK_KINDS[index % WORK_KINDS.length]!
  return {
    code: `KB-${200 + index}`,
    name: `${kind.subject} study ${Math.floor(index / WORK_KINDS.length) + 1}`,
    client: rng.pick(CLIENTS),
    description: `${kind.subject}: a study for the client's design review.`,
    kind: index % WORK_KINDS.length,
  }
}

const FIRST = ['Alex', 'Bea', 'Chidi', 'Dana', 'Emil', 'Farah', 'Gus', 'Hana', 'Ivo', 'Jun', 'Kofi', 'Lena', 'Milo', 'Noor', 'Otto']
const LAST = ['Abbott', 'Brandt', 'Costa', 'Dahl', 'Eze', 'Fischer', 'Gallo', 'Haas', 'Ilves', 'Juarez', 'Keane', 'Lund', 'Moreau', 'Nakamura', 'Osei']
export function staffName(index: number) {
  return `${FIRST[index % FIRST.length]} ${LAST[(index * 7 + 3) % LAST.length]}`
}

/** A case of the project's kind with its own sizes, speeds, budget and questions. */
export function variedCase(kind: number, rng: Random): CaseInputDraft {
  const base = WORK_KINDS[kind]!.base as CaseInputDraft
  const budget = base.budget
  return {
    ...base,
    velocity: rng.around(base.velocity, 2),
    length: rng.around(base.length, 1.6),
    separation: rng.next() < 0.7 ? base.separation : rng.pick(['none', 'mild', 'massive'] as const),
    budget: { ...budget, coreHours: Math.round(rng.around(budget.coreHours, 4)) },
  }
}

/** How a decision's review ended: shares of a mature record (most closed, a queue, some drafts). */
export type Fate = 'draft' | 'sent-back' | 'in_review' | 'approved' | 'overridden'
export function fate(rng: Random, age: number): Fate {
  // The newest work is still open; older work is closed.
  const roll = rng.next()
  if (age < 0.05) return roll < 0.3 ? 'draft' : roll < 0.85 ? 'in_review' : 'approved'
  return roll < 0.04 ? 'draft' : roll < 0.07 ? 'sent-back' : roll < 0.18 ? 'in_review' : roll < 0.86 ? 'approved' : 'overridden'
}

type EventRow = typeof schema.decisionEvents.$inferInsert
type DecisionRow = typeof schema.decisions.$inferInsert

const HOUR = 3600 * 1000

/** A reviewer's alternative: the neighbouring approach with its default model and wall treatment. */
function reviewerChoice(recommended: string, rng: Random) {
  const ids = TURBULENCE_APPROACH_IDS
  // A laminar recommendation (not in the list) is overridden by steady RANS.
  const index = ids.indexOf(recommended as (typeof ids)[number])
  const approach = index < 0 ? 'rans' : ids[index === 0 ? 1 : index === ids.length - 1 ? index - 1 : index + (rng.next() < 0.5 ? -1 : 1)]!
  return {
    approach,
    model: MODELS_BY_APPROACH[approach][0]!,
    wallTreatment: WALL_TREATMENTS_BY_APPROACH[approach][0]!,
    comment: 'The team has validated this approach on similar cases; the engine\'s choice is over-resolved for what the client needs.',
  }
}

/**
 * One decision's rows: the decision, its revision and its chained events, as insertDecision,
 * changeDecision and the review steps would write them at those times.
 */
export function plannedDecision(input: {
  id: number
  projectId: number
  title: string
  caseInput: CaseInputDraft
  author: Person
  reviewer: Person
  fate: Fate
  at: Date
  supersedes?: number
  rng: Random
}) {
  const record = adviceRecord({ caseInput: input.caseInput })
  const events: EventRow[] = []
  let prevHash = GENESIS_HASH
  let time = input.at.getTime()
  const decision: DecisionRow = {
    id: input.id, projectId: input.projectId, title: input.title, status: 'draft', version: 1, currentRevision: 1, unitSystem: record.unitSystem,
    authorId: input.author.id, supersedesId: input.supersedes ?? null, createdAt: input.at, updatedAt: input.at,
  }
  const chain = (type: DecisionEventType, actor: Person, payload: Record<string, unknown>, status?: DecisionStatus) => {
    const fields: HashedFields = {
      decisionId: input.id, seq: events.length + 1, type, actorId: actor.id, actorRole: actor.role,
      payload: JSON.parse(JSON.stringify(payload)), createdAt: new Date(time),
    }
    const hash = eventHash(prevHash, fields)
    events.push({ ...fields, actorRole: actor.role, payload: fields.payload as Record<string, unknown>, prevHash, hash })
    prevHash = hash
    if (status) Object.assign(decision, { status, version: decision.version! + 1, updatedAt: new Date(time) })
  }
  const later = (hours: number) => { time += hours * HOUR * (0.5 + input.rng.next()) }

  chain('created', input.author, { ...revisionPayload(1, record, input.title), ...(input.supersedes ? { supersedes: input.supersedes } : {}) })
  if (input.fate === 'draft') {
    later(20)
    chain('commented', input.author, { comment: 'Waiting for the client\'s inlet conditions before submitting.' })
  } else {
    later(30)
    chain('submitted', input.author, {}, 'in_review')
    later(48)
    if (input.fate === 'sent-back') {
      chain('changes_requested', input.reviewer, { comment: 'Please state the inlet turbulence you assumed and why.' }, 'draft')
    } else if (input.fate === 'approved') {
      chain('approved', input.reviewer, { comment: 'Agreed for this stage of the design.' }, 'approved')
    } else if (input.fate === 'overridden') {
      const choice = { ...reviewerChoice(record.advice.recommendation.approach, input.rng), disagreedRules: firedRules(record.advice).slice(0, 1) }
      const { override, payload } = overrideRecord({ caseInput: record.caseInput, advice: record.advice }, choice, { id: input.reviewer.id, name: input.reviewer.name })
      decision.override = override
      chain('overridden', input.reviewer, payload, 'overridden')
    }
  }
  const revision = revisionValues(input.id, 1, record, '', input.author, input.at)
  // A closed decision replaced by a newer one: supersedeDecision's event on the old one.
  const supersede = (by: number, actor: Person, at: Date) => {
    time = at.getTime()
    decision.supersededById = by
    chain('superseded', actor, { supersededBy: by }, 'superseded')
  }
  return { decision, revision, events, end: new Date(time), supersede }
}

function firedRules(advice: { trace: { rule: string; fired: boolean }[] }) {
  return advice.trace.filter(entry => entry.fired).map(entry => entry.rule)
}
