// The tables. Types for the app are inferred from here (shared/types/db.ts); relative imports only,
// so scripts under plain Node (tsx) can load it too.
import { sql } from 'drizzle-orm'
import {
  bigint, bigserial, boolean, date, doublePrecision, index, integer, jsonb, numeric, pgEnum, pgTable, primaryKey, serial, text, timestamp, uniqueIndex,
} from 'drizzle-orm/pg-core'
import type { Advice, ApproachId, CaseInput, Rule, Ruleset, WallTreatment } from '../../shared/rules'
import type { EnteredCase } from '../../shared/schemas/case-form'
import type { DecisionEventPayload, DecisionOverride, RequestedChoice } from '../../shared/types/decisions'
import type { ExpectedRecommendation, RulesetEventPayload } from '../../shared/types/rulesets'
import { UNIT_SYSTEMS } from '../../shared/units/catalogue'
import { DECISION_STATUSES } from '../../shared/utils/decision-status'
import { ROLES } from '../../shared/utils/roles'
import { APPROACH_IDS } from '../../shared/rules/approaches'
import type { AdoptedEntry } from '../../shared/verification/calibration'
import type { GridLevel, GridStudyResult } from '../../shared/verification/grid-convergence'
import type { WallCheckColumns, WallCheckResult } from '../../shared/verification/wall-check'
import type { YPlusBand } from '../../shared/verification/wall-yplus'
import { RULESET_STATUSES } from '../../shared/utils/ruleset-status'

export const EVENT_TYPES = [
  'created', 'revised', 'submitted', 'approved', 'overridden', 'changes_requested', 'commented', 'superseded',
  // After the run: verification records added to a signed-off decision.
  'wall_check_uploaded', 'wall_check_reviewed', 'grid_study_recorded', 'run_recorded', 'verification_retracted',
] as const

export const roleEnum = pgEnum('role', ROLES)
export const decisionStatusEnum = pgEnum('decision_status', DECISION_STATUSES)
export const eventTypeEnum = pgEnum('decision_event_type', EVENT_TYPES)
export const unitSystemEnum = pgEnum('unit_system', UNIT_SYSTEMS)

const timestamps = {
  createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
}

export const users = pgTable('users', {
  id: serial('id').primaryKey(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  role: roleEnum('role').notNull(),
  // Null until an invited user sets a password.
  passwordHash: text('password_hash'),
  active: boolean('active').notNull().default(true),
  // Sealed into each session at sign-in; raising it ends every session of the user (password
  // change, deactivation, role change, "sign out everywhere").
  sessionVersion: integer('session_version').notNull().default(1),
  ...timestamps,
}, t => [uniqueIndex('users_email_lower_idx').on(sql`lower(${t.email})`)])

// Sessions ended by signing out, until their cookie would have expired anyway: a copy of the
// cookie stops working too.
export const revokedSessions = pgTable('revoked_sessions', {
  id: text('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
}, t => [index('revoked_sessions_expires_idx').on(t.expiresAt)])

export const projects = pgTable('projects', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  client: text('client').notNull().default(''),
  description: text('description').notNull().default(''),
  archived: boolean('archived').notNull().default(false),
  ...timestamps,
})

export const projectMembers = pgTable('project_members', {
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  addedAt: timestamp('added_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [primaryKey({ columns: [t.projectId, t.userId] }), index('project_members_user_idx').on(t.userId)])

// Failed sign-in counters, keyed by "account:<email>" or "client:<address>"; in the database so
// the limit holds across server processes.
export const loginAttempts = pgTable('login_attempts', {
  key: text('key').primaryKey(),
  failures: integer('failures').notNull().default(0),
  windowStartedAt: timestamp('window_started_at', { withTimezone: true }).notNull().defaultNow(),
  lockedUntil: timestamp('locked_until', { withTimezone: true }),
})

export const decisions = pgTable('decisions', {
  id: serial('id').primaryKey(),
  projectId: integer('project_id').notNull().references(() => projects.id),
  title: text('title').notNull(),
  status: decisionStatusEnum('status').notNull().default('draft'),
  // Optimistic concurrency: every change increments it; clients send back the one they saw.
  version: integer('version').notNull().default(1),
  currentRevision: integer('current_revision').notNull().default(1),
  authorId: integer('author_id').notNull().references(() => users.id),
  // The unit system of the current revision, for lists and mail.
  unitSystem: unitSystemEnum('unit_system').notNull().default('si'),
  // The reviewer's choice when overridden, with its recomputed near-wall mesh and cost.
  override: jsonb('override').$type<DecisionOverride>(),
  supersedesId: integer('supersedes_id'),
  supersededById: integer('superseded_by_id'),
  ...timestamps,
}, t => [index('decisions_project_idx').on(t.projectId, t.updatedAt), index('decisions_status_idx').on(t.status)])

// Append-only (trigger in a custom migration): every revision of the input and its advice.
export const decisionRevisions = pgTable('decision_revisions', {
  id: serial('id').primaryKey(),
  decisionId: integer('decision_id').notNull().references(() => decisions.id),
  revision: integer('revision').notNull(),
  // The engine's SI case; beside it the values as typed, with their units, and the unit system.
  caseInput: jsonb('case_input').$type<CaseInput>().notNull(),
  unitSystem: unitSystemEnum('unit_system').notNull().default('si'),
  // Null on revisions stored before the typed values were kept: shown converted from SI.
  entered: jsonb('entered').$type<EnteredCase>(),
  // The engineer's own approach or wall treatment against the engine's, with the reason and figures.
  requested: jsonb('requested').$type<RequestedChoice>(),
  advice: jsonb('advice').$type<Advice>().notNull(),
  notes: text('notes').notNull().default(''),
  inputHash: text('input_hash').notNull(),
  rulesetId: text('ruleset_id').notNull(),
  rulesetVersion: text('ruleset_version').notNull(),
  engineVersion: text('engine_version').notNull(),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('decision_revisions_unique').on(t.decisionId, t.revision)])

// Append-only, hash-chained per decision: hash = sha256(prevHash + canonical event).
export const decisionEvents = pgTable('decision_events', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  decisionId: integer('decision_id').notNull().references(() => decisions.id),
  seq: integer('seq').notNull(),
  type: eventTypeEnum('type').notNull(),
  actorId: integer('actor_id').notNull().references(() => users.id),
  actorRole: roleEnum('actor_role').notNull(),
  payload: jsonb('payload').$type<DecisionEventPayload>().notNull().default({}),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull(),
  prevHash: text('prev_hash').notNull(),
  hash: text('hash').notNull(),
}, t => [uniqueIndex('decision_events_seq_unique').on(t.decisionId, t.seq)])

// One row per decision: the figures the lists, the audit and the overview read, in typed columns
// with indexes for each filter and sort, so no request re-reads the advice of every decision. It
// is derived from the decision, its current revision and its events by the view
// decision_summary_source (custom migration) and rewritten in the same transaction as every change
// (server/utils/decisions/summary.ts); rows are never deleted (trigger).
export const decisionSummaries = pgTable('decision_summaries', {
  decisionId: integer('decision_id').primaryKey().references(() => decisions.id),
  projectId: integer('project_id').notNull().references(() => projects.id),
  title: text('title').notNull(),
  status: decisionStatusEnum('status').notNull(),
  version: integer('version').notNull(),
  revision: integer('revision').notNull(),
  unitSystem: unitSystemEnum('unit_system').notNull(),
  authorId: integer('author_id').notNull().references(() => users.id),
  // Who approved or overrode it, and when; null until then.
  reviewerId: integer('reviewer_id').references(() => users.id),
  // The reviewer who sent it back, while that is the last thing that happened to it (comments aside).
  changesRequestedBy: integer('changes_requested_by').references(() => users.id),
  // What the decision stands for: the reviewer's override, else the engineer's requested choice,
  // else the engine's recommendation.
  approach: text('approach').$type<ApproachId>().notNull(),
  model: text('model').notNull(),
  wallTreatment: text('wall_treatment').$type<WallTreatment>().notNull(),
  // What the engine recommended, for the override pairs.
  engineApproach: text('engine_approach').$type<ApproachId>().notNull(),
  overridden: boolean('overridden').notNull(),
  overrideReason: text('override_reason'),
  disagreedRules: text('disagreed_rules').array().notNull(),
  reynolds: doublePrecision('reynolds').notNull(),
  // The engine's core-hours for the approach it stands for, and the case's budget.
  coreHours: doublePrecision('core_hours'),
  budgetCoreHours: doublePrecision('budget_core_hours').notNull(),
  rulesetId: text('ruleset_id').notNull(),
  rulesetVersion: text('ruleset_version').notNull(),
  engineVersion: text('engine_version').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull(),
  submittedAt: timestamp('submitted_at', { withTimezone: true }),
  reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
}, t => [
  // Lists, newest activity first: all, by project, by status, by both (keyset on updated_at, id).
  index('decision_summaries_updated_idx').on(t.updatedAt, t.decisionId),
  index('decision_summaries_project_updated_idx').on(t.projectId, t.updatedAt, t.decisionId),
  index('decision_summaries_status_updated_idx').on(t.status, t.updatedAt, t.decisionId),
  index('decision_summaries_project_status_updated_idx').on(t.projectId, t.status, t.updatedAt, t.decisionId),
  // The review queue: decisions in review, longest waiting first; with the project and author
  // its filter reads, so counting the queue reads the index alone.
  index('decision_summaries_queue_idx').on(t.submittedAt, t.decisionId, t.projectId, t.authorId).where(sql`${t.status} = 'in_review'`),
  // Search by author; by title through a trigram index (pg_trgm, in the custom migration).
  index('decision_summaries_author_updated_idx').on(t.authorId, t.updatedAt, t.decisionId),
  // The overview's days at either end of a range that do not fill a month (see decision_tallies).
  index('decision_summaries_created_idx').on(t.createdAt),
  index('decision_summaries_project_created_idx').on(t.projectId, t.createdAt),
  // The overview's disagreed rules at those ends.
  index('decision_summaries_overridden_created_idx').on(t.createdAt).where(sql`${t.overridden}`),
])

// The overview's running totals per project and calendar month (UTC) of creation, by what the
// decisions stand for: kept by a trigger on decision_summaries in the same transaction (custom
// migration), so the overview adds up a few thousand rows, not every decision. Sums are numeric:
// a decision moving between groups subtracts exactly what it had added.
export const decisionTallies = pgTable('decision_tallies', {
  month: date('month', { mode: 'string' }).notNull(),
  projectId: integer('project_id').notNull().references(() => projects.id),
  status: decisionStatusEnum('status').notNull(),
  approach: text('approach').$type<ApproachId>().notNull(),
  model: text('model').notNull(),
  engineApproach: text('engine_approach').$type<ApproachId>().notNull(),
  overridden: boolean('overridden').notNull(),
  decisions: integer('decisions').notNull(),
  coreHours: numeric('core_hours').notNull(),
  budgetCoreHours: numeric('budget_core_hours').notNull(),
  overBudget: integer('over_budget').notNull(),
}, t => [
  primaryKey({ columns: [t.month, t.projectId, t.status, t.approach, t.model, t.engineApproach, t.overridden] }),
  index('decision_tallies_project_idx').on(t.projectId, t.month),
])

// How often overriding reviewers named each rule, per project, month and status, kept the same way.
export const decisionRuleTallies = pgTable('decision_rule_tallies', {
  month: date('month', { mode: 'string' }).notNull(),
  projectId: integer('project_id').notNull().references(() => projects.id),
  status: decisionStatusEnum('status').notNull(),
  rule: text('rule').notNull(),
  decisions: integer('decisions').notNull(),
}, t => [
  primaryKey({ columns: [t.month, t.projectId, t.status, t.rule] }),
  index('decision_rule_tallies_project_idx').on(t.projectId, t.month),
])

// Decisions per ruleset version, per project, month and status, kept the same way (the overview's
// "decisions by ruleset version").
export const decisionRulesetTallies = pgTable('decision_ruleset_tallies', {
  month: date('month', { mode: 'string' }).notNull(),
  projectId: integer('project_id').notNull().references(() => projects.id),
  status: decisionStatusEnum('status').notNull(),
  rulesetId: text('ruleset_id').notNull(),
  rulesetVersion: text('ruleset_version').notNull(),
  decisions: integer('decisions').notNull(),
}, t => [
  primaryKey({ columns: [t.month, t.projectId, t.status, t.rulesetId, t.rulesetVersion] }),
  index('decision_ruleset_tallies_project_idx').on(t.projectId, t.month),
])

// Outgoing mail is written in the same transaction as the action, then delivered after commit and
// retried on failure, so a failed send never loses the action.
export const mailOutbox = pgTable('mail_outbox', {
  id: serial('id').primaryKey(),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  kind: text('kind').notNull(),
  status: text('status', { enum: ['pending', 'sent', 'failed'] }).notNull().default('pending'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
  // The sender that holds the lease (next_attempt_at) on a message being sent; its result is
  // written only while it still holds it.
  claimToken: text('claim_token'),
  sentAt: timestamp('sent_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt)])

// Single-use links (invitation, password reset); only a hash of the token is stored.
export const userTokens = pgTable('user_tokens', {
  id: serial('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  purpose: text('purpose', { enum: ['invite', 'reset'] }).notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
})

// ---- after the run: verification records of a signed-off decision. Rows are never deleted; the
// review and retraction columns are set once (trigger in a custom migration), and each change is
// also an event in the decision's chained history.

const retraction = {
  retractedAt: timestamp('retracted_at', { withTimezone: true }),
  retractedBy: integer('retracted_by').references(() => users.id),
  retractionReason: text('retraction_reason'),
}

// A solver's wall export, kept in object storage; its statistics against the signed-off y+ band.
export const wallChecks = pgTable('wall_checks', {
  id: serial('id').primaryKey(),
  decisionId: integer('decision_id').notNull().references(() => decisions.id),
  uploadedBy: integer('uploaded_by').notNull().references(() => users.id),
  fileName: text('file_name').notNull(),
  contentType: text('content_type').notNull(),
  compressed: boolean('compressed').notNull(),
  storageKey: text('storage_key').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  sha256: text('sha256').notNull(),
  columns: jsonb('columns').$type<WallCheckColumns>().notNull(),
  band: jsonb('band').$type<YPlusBand>().notNull(),
  result: jsonb('result').$type<WallCheckResult>().notNull(),
  passFraction: doublePrecision('pass_fraction').notNull(),
  verdict: text('verdict', { enum: ['pass', 'fail'] }).notNull(),
  reviewAccepted: boolean('review_accepted'),
  reviewedBy: integer('reviewed_by').references(() => users.id),
  reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
  reviewComment: text('review_comment'),
  ...retraction,
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('wall_checks_decision_idx').on(t.decisionId)])

export const gridStudies = pgTable('grid_studies', {
  id: serial('id').primaryKey(),
  decisionId: integer('decision_id').notNull().references(() => decisions.id),
  createdBy: integer('created_by').notNull().references(() => users.id),
  quantity: text('quantity').notNull(),
  unit: text('unit').notNull().default(''),
  dimensions: integer('dimensions').notNull(),
  grids: jsonb('grids').$type<GridLevel[]>().notNull(),
  result: jsonb('result').$type<GridStudyResult>().notNull(),
  ...retraction,
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('grid_studies_decision_idx').on(t.decisionId)])

// What a run really took, with the engine's estimate for the same approach beside it.
export const runRecords = pgTable('run_records', {
  id: serial('id').primaryKey(),
  decisionId: integer('decision_id').notNull().references(() => decisions.id),
  createdBy: integer('created_by').notNull().references(() => users.id),
  approach: text('approach', { enum: APPROACH_IDS }).notNull(),
  cells: doublePrecision('cells').notNull(),
  // Physical time steps (iterations for steady RANS); inner iterations per step for information.
  timeSteps: doublePrecision('time_steps').notNull(),
  innerIterations: integer('inner_iterations'),
  coreHours: doublePrecision('core_hours').notNull(),
  wallClockHours: doublePrecision('wall_clock_hours').notNull(),
  cores: integer('cores').notNull(),
  hardware: text('hardware', { enum: ['cpu', 'gpu'] }).notNull(),
  hardwareNote: text('hardware_note').notNull().default(''),
  solverFamily: text('solver_family').notNull().default(''),
  estimated: jsonb('estimated').$type<{ cells: number; timeSteps: number; coreHours: number } | null>(),
  ...retraction,
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('run_records_decision_idx').on(t.decisionId), index('run_records_approach_idx').on(t.approach, t.hardware)])

// Append-only: each adoption of the team's calibration is a new version; the latest is in force.
export const calibrationAdoptions = pgTable('calibration_adoptions', {
  version: serial('version').primaryKey(),
  adoptedBy: integer('adopted_by').notNull().references(() => users.id),
  entries: jsonb('entries').$type<AdoptedEntry[]>().notNull(),
  runIds: jsonb('run_ids').$type<number[]>().notNull(),
  note: text('note').notNull().default(''),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
})

// Append-only: the team's verification settings, one row per change; the latest is in force.
export const teamSettings = pgTable('team_settings', {
  id: serial('id').primaryKey(),
  wallCheckPassFraction: doublePrecision('wall_check_pass_fraction').notNull(),
  setBy: integer('set_by').notNull().references(() => users.id),
  note: text('note').notNull().default(''),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
})

// ---- The team's rulesets: versions of the engine's rules as data.

export const RULESET_EVENT_TYPES = ['installed', 'published'] as const
export const rulesetStatusEnum = pgEnum('ruleset_status', RULESET_STATUSES)
export const rulesetEventTypeEnum = pgEnum('ruleset_event_type', RULESET_EVENT_TYPES)

// One row per version, in the shape the engine reads (key = the ruleset's id there). A published or
// retired row is immutable and kept for good (trigger in a custom migration); drafts are edited.
export const rulesets = pgTable('rulesets', {
  id: serial('id').primaryKey(),
  key: text('key').notNull(),
  version: text('version').notNull(),
  status: rulesetStatusEnum('status').notNull().default('draft'),
  baseScores: jsonb('base_scores').$type<Ruleset['baseScores']>().notNull(),
  baseWhy: text('base_why').notNull(),
  rules: jsonb('rules').$type<Rule[]>().notNull(),
  // The lead's change note: worked on in the draft, fixed at publication.
  note: text('note').notNull().default(''),
  basedOnId: integer('based_on_id'),
  // sha256 of the canonical engine form, fixed at publication and chained into the history.
  contentHash: text('content_hash'),
  // Null for the version installed with the engine.
  createdBy: integer('created_by').references(() => users.id),
  publishedBy: integer('published_by').references(() => users.id),
  publishedAt: timestamp('published_at', { withTimezone: true }),
  retiredAt: timestamp('retired_at', { withTimezone: true }),
  ...timestamps,
}, t => [
  uniqueIndex('rulesets_released_version_unique').on(t.key, t.version).where(sql`${t.status} <> 'draft'`),
  uniqueIndex('rulesets_one_published').on(t.status).where(sql`${t.status} = 'published'`),
])

// A ruleset's canonical cases: inputs with the recommendation the team expects. Kept with a
// published version as it was (trigger), copied into each new draft.
export const rulesetCases = pgTable('ruleset_cases', {
  id: serial('id').primaryKey(),
  rulesetId: integer('ruleset_id').notNull().references(() => rulesets.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  title: text('title').notNull(),
  caseInput: jsonb('case_input').$type<CaseInput>().notNull(),
  expected: jsonb('expected').$type<ExpectedRecommendation>().notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('ruleset_cases_position_unique').on(t.rulesetId, t.position)])

// The ruleset history: append-only (trigger) and one hash chain over every version's
// installation and publication, hash = sha256(prevHash + canonical event).
export const rulesetEvents = pgTable('ruleset_events', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  seq: integer('seq').notNull().unique(),
  rulesetId: integer('ruleset_id').notNull().references(() => rulesets.id),
  type: rulesetEventTypeEnum('type').notNull(),
  // Null for the installation of the engine's own ruleset.
  actorId: integer('actor_id').references(() => users.id),
  actorRole: roleEnum('actor_role'),
  payload: jsonb('payload').$type<RulesetEventPayload>().notNull().default({}),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull(),
  prevHash: text('prev_hash').notNull(),
  hash: text('hash').notNull(),
})

// The ledger: one append-only, hash-chained sequence across every decision and everything the
// record depends on (server/db/ledger.ts). Each entry commits to one record by its hash: a decision
// event (its chained hash), a stored revision, a ruleset version, a signing key. The sequence is
// gap-free: appends are serialized, so a missing number means a removed entry.
export const ledgerEntries = pgTable('ledger_entries', {
  seq: bigint('seq', { mode: 'number' }).primaryKey(),
  subjectType: text('subject_type').notNull(),
  subjectId: text('subject_id').notNull(),
  type: text('type').notNull(),
  // The row the entry commits to (null when the record lives outside the database, e.g. a ruleset in code).
  recordTable: text('record_table'),
  recordId: bigint('record_id', { mode: 'number' }),
  recordHash: text('record_hash').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull(),
  prevHash: text('prev_hash').notNull(),
  hash: text('hash').notNull(),
}, t => [
  index('ledger_entries_subject_idx').on(t.subjectType, t.subjectId, t.seq),
  uniqueIndex('ledger_entries_record_unique').on(t.recordTable, t.recordId),
])

// Public halves of the keys that sign checkpoints; the private key never enters the database. The
// newest row is the active key, earlier ones are retired but stay so that old receipts verify.
export const ledgerKeys = pgTable('ledger_keys', {
  id: serial('id').primaryKey(),
  keyId: text('key_id').notNull().unique(),
  algorithm: text('algorithm').notNull().default('ed25519'),
  publicKey: text('public_key').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull(),
})

// Signed heads of the ledger, numbered without gaps; each is also mailed to the auditors as a receipt.
export const ledgerCheckpoints = pgTable('ledger_checkpoints', {
  number: integer('number').primaryKey(),
  seq: bigint('seq', { mode: 'number' }).notNull(),
  hash: text('hash').notNull(),
  signedAt: timestamp('signed_at', { withTimezone: true, mode: 'date' }).notNull(),
  keyId: text('key_id').notNull(),
  signature: text('signature').notNull(),
  // What made it: 'count', 'time', 'request' (an auditor or admin), 'rotation'.
  reason: text('reason').notNull(),
})

// Runs of the ledger verification. A clean, signed run is the anchor the next incremental run starts
// from: rows written since its snapshot (by transaction id) are the ones rechecked.
export const ledgerVerifications = pgTable('ledger_verifications', {
  id: serial('id').primaryKey(),
  mode: text('mode', { enum: ['incremental', 'full'] }).notNull(),
  startedAt: timestamp('started_at', { withTimezone: true, mode: 'date' }).notNull(),
  finishedAt: timestamp('finished_at', { withTimezone: true, mode: 'date' }).notNull(),
  // pg_snapshot_xmin of the run's snapshot (xid8 as text): every transaction before it was seen.
  snapshotXmin: text('snapshot_xmin').notNull(),
  headSeq: bigint('head_seq', { mode: 'number' }).notNull(),
  headHash: text('head_hash').notNull(),
  entries: integer('entries').notNull(),
  checkpoints: integer('checkpoints').notNull(),
  problems: jsonb('problems').notNull().$type<{ kind: string; decisionId?: number; seq?: number; detail: string }[]>(),
  keyId: text('key_id'),
  signature: text('signature'),
})
