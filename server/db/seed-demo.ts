// The demo scenario: Kestrel Bay Flow Consulting, a fictional CFD consultancy, and four projects of
// its own. Relative imports only: run by scripts/seed.ts under plain Node.
import type { NodePgDatabase } from 'drizzle-orm/node-postgres'
import { advise, caseInputSchema, compileRuleset, RulesetInvalidError, type CaseInputDraft, type Ruleset } from '../../shared/rules'
import { changeDecision, insertDecision, overrideRecord, reviseDecisionRecord } from '../utils/decisions/record'
import { checkCases } from '../utils/rulesets/cases'
import { insertDraft, releaseDraft, shippedRulesets, type CanonicalCase } from '../utils/rulesets/catalogue'
import { appendChainedEvent } from './event-chain'
import * as schema from './schema'

type Db = NodePgDatabase<typeof schema>

export const DEMO_DOMAIN = 'eddyledger.test'

export const DEMO_USERS = [
  { key: 'engineer', name: 'Ada Ferreira', role: 'engineer' },
  { key: 'engineer2', name: 'Tomas Lindqvist', role: 'engineer' },
  { key: 'reviewer', name: 'Priya Raman', role: 'reviewer' },
  { key: 'reviewer2', name: 'Jonah Okafor', role: 'reviewer' },
  { key: 'auditor', name: 'Mei Tanaka', role: 'auditor' },
  { key: 'lead', name: 'Ruth Calder', role: 'lead' },
  { key: 'admin', name: 'Sam Ortiz', role: 'admin' },
] as const

export const DEMO_PROJECTS = [
  {
    code: 'KB-101', name: 'Harbour ferry hull resistance', client: 'Saltmarsh Ferry Company',
    description: 'Calm-water resistance of a 38 m passenger ferry hull at service speed, model and full scale.',
    members: ['engineer', 'reviewer'],
  },
  {
    code: 'KB-102', name: 'Data-hall cooling air ducts', client: 'Gridline Hosting',
    description: 'Pressure drop and wall heat transfer in the supply ducts of a new data hall.',
    members: ['engineer', 'engineer2', 'reviewer', 'reviewer2'],
  },
  {
    code: 'KB-103', name: 'Rooftop condenser wake and noise', client: 'Marlow Street Developments',
    description: 'Separated wake of rooftop condenser units and its tonal noise at the neighbouring facade.',
    members: ['engineer', 'engineer2', 'reviewer', 'reviewer2'],
  },
  {
    code: 'KB-104', name: 'Pump intake swirl', client: 'Fenwater Utilities',
    description: 'Swirl and vortex formation at the intake bay of a raw-water pumping station.',
    members: ['engineer2', 'reviewer2'],
  },
] as const

export async function seedDemo(db: Db, passwordHash: string) {
  const users = await db.insert(schema.users).values(DEMO_USERS.map(u => ({
    email: `${u.key}@${DEMO_DOMAIN}`, name: u.name, role: u.role, passwordHash,
  }))).returning()
  const userByKey = new Map(DEMO_USERS.map((u, i) => [u.key, users[i]!]))

  for (const p of DEMO_PROJECTS) {
    const [project] = await db.insert(schema.projects).values({
      code: p.code, name: p.name, client: p.client, description: p.description,
    }).returning()
    await db.insert(schema.projectMembers).values(p.members.map(key => ({
      projectId: project!.id, userId: userByKey.get(key)!.id,
    })))
  }
  await seedDemoDecisions(db, userByKey, await seedDemoRulesets(db, userByKey))
  return { users: userByKey }
}

type DemoUser = typeof schema.users.$inferSelect
type DemoUserKey = (typeof DEMO_USERS)[number]['key']

const DAY = 24 * 3600 * 1000

// Demo cases, physically sensible for each project (SI units).
export const FERRY_HULL: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'water', temperatureK: 288.15 },
  velocity: 6, // about 11.7 kn service speed
  length: 36, // waterline length of the 38 m hull
  geometry: 'streamlined',
  separation: 'mild',
  quantities: ['forces', 'pressure'],
  budget: { coreHours: 20_000, cores: 256, wallClockHours: 72 },
}

export const DATA_HALL_DUCT: CaseInputDraft = {
  regime: 'internal',
  fluid: { medium: 'air', temperatureK: 295, pressurePa: 101_325 },
  velocity: 8,
  length: 0.6, // duct diameter
  roughness: 0.00015, // galvanised steel sheet, about 0.15 mm
  geometry: 'duct',
  separation: 'none',
  physics: { heatTransfer: true },
  quantities: ['pressure', 'heat-transfer'],
  budget: { coreHours: 5_000, cores: 128, wallClockHours: 48 },
}

export const CONDENSER_WAKE: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'air', temperatureK: 288.15, pressurePa: 101_325 },
  velocity: 10, // design wind at roof height
  length: 2, // condenser unit height
  turbulenceIntensity: 0.1,
  geometry: 'bluff',
  separation: 'massive',
  physics: { acoustics: true },
  quantities: ['noise', 'unsteady-loads'],
  budget: { coreHours: 200_000, cores: 1024, wallClockHours: 168 },
}

export const PUMP_INTAKE: CaseInputDraft = {
  regime: 'internal',
  fluid: { medium: 'water', temperatureK: 283.15 },
  velocity: 1.2, // bell-mouth approach velocity
  length: 1.5, // bell-mouth diameter
  geometry: 'complex',
  separation: 'mild',
  physics: { rotation: true },
  quantities: ['pressure', 'statistics'],
  budget: { coreHours: 30_000, cores: 256, wallClockHours: 96 },
}

// Kestrel Bay's own canonical cases: what the team expects its rules to recommend.
export const DEMO_CANONICAL_CASES: CanonicalCase[] = [
  {
    title: 'Ferry hull at service speed, mild separation at the transom',
    caseInput: caseInputSchema.parse(FERRY_HULL),
    expected: { approach: 'rans', model: 'k-omega SST', wallTreatment: 'wall-function' },
  },
  {
    title: 'Data-hall supply duct with wall heat transfer',
    caseInput: caseInputSchema.parse(DATA_HALL_DUCT),
    expected: { approach: 'rans', model: 'k-omega SST', wallTreatment: 'resolved' },
  },
  { title: 'Rooftop condenser wake and tonal noise', caseInput: caseInputSchema.parse(CONDENSER_WAKE), expected: { approach: 'hybrid' } },
  { title: 'Pump intake swirl with turbulence statistics', caseInput: caseInputSchema.parse(PUMP_INTAKE), expected: { approach: 'wmles' } },
]

const SEED_START = () => Date.now() - 14 * DAY

type DemoRulesets = { earlier: Ruleset | null; current: Ruleset }

/**
 * The team's ruleset versions: every version the engine shipped, published in turn by the lead,
 * the built-in one last with the team's canonical cases. When there is an earlier version, the
 * first demo decisions are made with it and the built-in one is published in between.
 */
export async function seedDemoRulesets(db: Db, users: Map<DemoUserKey, DemoUser>): Promise<DemoRulesets> {
  const lead = users.get('lead')!
  const shipped = shippedRulesets()
  const builtIn = shipped.at(-1)!
  const current = compileRuleset(builtIn)
  const failing = checkCases(current, DEMO_CANONICAL_CASES).filter(item => !item.passes)
  if (failing.length) throw new Error(`demo canonical cases fail under ${builtIn.version}: ${failing.map(f => `${f.title}: ${f.misses.join(', ')}`).join('; ')}`)
  const at = (days: number) => new Date(SEED_START() + days * DAY)
  await db.transaction(async (tx) => {
    for (const [index, source] of shipped.slice(0, -1).entries()) {
      const row = await insertDraft(tx, { source, actor: lead, at: at(-40 + index) })
      await releaseDraft(tx, { row, note: `Our first ruleset: the engine's rules ${source.version} as shipped.`, actor: lead, at: at(-40 + index) })
    }
    const publishAt = shipped.length > 1 ? at(7) : at(-1)
    const row = await insertDraft(tx, { source: builtIn, actor: lead, cases: DEMO_CANONICAL_CASES, at: publishAt })
    await releaseDraft(tx, {
      row, actor: lead, at: publishAt,
      note: `The engine's rules ${builtIn.version}, with our canonical cases: the hull, the duct, the condenser wake and the pump intake.`,
    })
  })
  let earlier: Ruleset | null = null
  try {
    earlier = shipped.length > 1 ? compileRuleset(shipped.at(-2)) : null
  } catch (error) {
    // An earlier version that no longer fits the engine's schema is kept as a record only.
    if (!(error instanceof RulesetInvalidError)) throw error
  }
  return { earlier, current }
}

/**
 * A few decisions at every stage of review, written through the same record steps as the server
 * (advice from advise(), revisions, chained events), dated over the last fortnight; the first
 * ones with the earlier ruleset version when the seed has one.
 */
export async function seedDemoDecisions(db: Db, users: Map<DemoUserKey, DemoUser>, rulesets?: DemoRulesets) {
  const user = (key: DemoUserKey) => users.get(key)!
  const projects = await db.select().from(schema.projects)
  const project = (code: string) => projects.find(p => p.code === code)!.id
  const start = SEED_START()
  const at = (days: number) => new Date(start + days * DAY)
  const ruleset = rulesets?.current
  const earlier = rulesets?.earlier ?? ruleset

  await db.transaction(async (tx) => {
    // KB-101: approved after a revision.
    const hull = await insertDecision(tx, {
      projectId: project('KB-101'), title: 'Ferry hull calm-water resistance at service speed',
      caseInput: { ...FERRY_HULL, separation: 'none' }, author: user('engineer'), ruleset: earlier,
      notes: 'Full-scale hull, bare, at 6 m/s.', at: at(0),
    })
    const revised = await reviseDecisionRecord(tx, {
      decisionId: hull.id, version: hull.version, caseInput: FERRY_HULL, actor: user('engineer'), ruleset: earlier, at: at(1),
      notes: 'Full-scale hull, bare, at 6 m/s. Mild separation expected at the transom stern.',
    })
    const submitted = await changeDecision(tx, {
      decisionId: hull.id, version: revised!.version, from: ['draft'], set: { status: 'in_review' },
      event: { type: 'submitted', actor: user('engineer') }, at: at(1.2),
    })
    await changeDecision(tx, {
      decisionId: hull.id, version: submitted!.version, from: ['in_review'], set: { status: 'approved' },
      event: { type: 'approved', actor: user('reviewer'), payload: { comment: 'Agreed: steady RANS with wall functions is the usual choice for calm-water resistance; check y+ on the stern.' } },
      at: at(2),
    })

    // KB-103: overridden by the second reviewer, with the author's reply.
    const wake = await insertDecision(tx, {
      projectId: project('KB-103'), title: 'Condenser wake and tonal noise at the east facade',
      caseInput: CONDENSER_WAKE, author: user('engineer'), ruleset: earlier, at: at(3),
      notes: 'Two units side by side; receiver at the facade 12 m downwind.',
    })
    const inReview = await changeDecision(tx, {
      decisionId: wake.id, version: wake.version, from: ['draft'], set: { status: 'in_review' },
      event: { type: 'submitted', actor: user('engineer') }, at: at(3.5),
    })
    const advice = advise(CONDENSER_WAKE, { ruleset: earlier })
    const recommended = advice.recommendation.approach
    const choice = recommended === 'hybrid'
      ? {
          approach: 'wmles' as const, model: 'WALE', wallTreatment: 'wall-model' as const,
          comment: 'The tonal peak comes from the shear layers off the casing edges, which the RANS region of a hybrid model would damp; wall-modelled LES keeps them resolved.',
        }
      : {
          approach: 'hybrid' as const, model: 'DDES', wallTreatment: 'wall-function' as const,
          comment: 'The noise comes from the wake, not the casing boundary layers: DDES with wall functions resolves the shedding at a fraction of the cost.',
        }
    const fired = advice.trace.filter(t => t.fired).map(t => t.rule)
    const disagreedRules = fired.includes('recirculation-needs-resolved-wall') ? ['recirculation-needs-resolved-wall'] : fired.slice(0, 1)
    const { override, payload } = overrideRecord(
      { caseInput: caseInputSchema.parse(CONDENSER_WAKE), advice },
      { ...choice, disagreedRules },
      { id: user('reviewer2').id, name: user('reviewer2').name },
    )
    await changeDecision(tx, {
      decisionId: wake.id, version: inReview!.version, from: ['in_review'], set: { status: 'overridden', override },
      event: { type: 'overridden', actor: user('reviewer2'), payload }, at: at(5),
    })
    await appendChainedEvent(tx, {
      decisionId: wake.id, type: 'commented', actor: user('engineer'), at: at(5.5),
      payload: { comment: 'Understood; I will place the acoustic probes at the facade positions from the site survey.' },
    })

    // KB-102: waiting for a reviewer.
    const duct = await insertDecision(tx, {
      projectId: project('KB-102'), title: 'Supply duct pressure drop and wall heat transfer',
      caseInput: DATA_HALL_DUCT, author: user('engineer2'), ruleset, at: at(11),
      notes: 'Main supply run, 0.6 m round galvanised duct.',
    })
    await changeDecision(tx, {
      decisionId: duct.id, version: duct.version, from: ['draft'], set: { status: 'in_review' },
      event: { type: 'submitted', actor: user('engineer2') }, at: at(12),
    })

    // KB-104: a draft still being worked on.
    await insertDecision(tx, {
      projectId: project('KB-104'), title: 'Intake bay swirl at the pump bell mouth',
      caseInput: PUMP_INTAKE, author: user('engineer2'), ruleset, at: at(13),
      notes: 'Pump 2 of 3, low water level case.',
    })
  })
}
