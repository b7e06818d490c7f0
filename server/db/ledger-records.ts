// What each kind of ledger entry commits to, and how its hash is computed again from the stored row.
// A new kind of record (a summary table, a run record...) adds a source here and appends its rows
// with appendLedgerEntry in the transaction that writes them; the verification then covers it:
// entries whose row is gone, rows that no entry holds, rows whose hash no longer matches.
import { eq, inArray, sql } from 'drizzle-orm'
import { RULESET } from '../../shared/rules'
import { eventHash } from './event-chain'
import { appendLedgerEntry, canonicalHash, lockLedger, type LedgerDbOrTx, type LedgerEntryInput } from './ledger'
import * as schema from './schema'

type RevisionRow = typeof schema.decisionRevisions.$inferSelect
type EventRow = typeof schema.decisionEvents.$inferSelect
type KeyRow = typeof schema.ledgerKeys.$inferSelect

/** The content of a stored revision, as hashed into the ledger: every column but the row id. */
export function revisionHash(r: Omit<RevisionRow, 'id'> & { id?: number }) {
  const { id: _id, ...content } = r
  return factsHash(content)
}

export function signingKeyHash(k: Omit<KeyRow, 'id'>) {
  return canonicalHash({ keyId: k.keyId, algorithm: k.algorithm, publicKey: k.publicKey, createdAt: k.createdAt.toISOString() })
}

export type RecordSource<Row = any> = {
  table: string
  /** What one row is called in a report ("event", "revision"). */
  noun: string
  load: (db: LedgerDbOrTx, ids: number[]) => Promise<Row[]>
  id: (row: Row) => number
  /** The row in a sentence: "Event #3 (approved) of decision 12". */
  describe: (row: Row) => string
  /** The hash the row's ledger entry must hold. */
  hash: (row: Row) => string
  /** When that hash is a column of the row itself, the check runs in SQL over every row. */
  hashColumn?: string
  /** The row's key column in SQL, when not `id`. */
  idColumn?: string
  /** The type of the row's ledger entry. */
  entryType: string
  /** The subject the row belongs to, as the entry names it. */
  subject: (row: Row) => { type: string; id: string }
  /** The row checked by itself (an event against its own chained hash); null when it holds. */
  selfCheck?: (row: Row) => string | null
}

const eventSource: RecordSource<EventRow> = {
  table: 'decision_events',
  noun: 'event',
  entryType: 'decision-event',
  load: (db, ids) => db.select().from(schema.decisionEvents).where(inArray(schema.decisionEvents.id, ids)),
  id: row => row.id,
  describe: row => `Event #${row.seq} (${row.type}) of decision ${row.decisionId}`,
  hash: row => row.hash,
  hashColumn: 'hash',
  subject: row => ({ type: 'decision', id: String(row.decisionId) }),
  selfCheck: row => eventHash(row.prevHash, row) === row.hash
    ? null
    : `Event #${row.seq} (${row.type}) of decision ${row.decisionId} no longer hashes to its stored hash: its content was changed`,
}

const revisionSource: RecordSource<RevisionRow> = {
  table: 'decision_revisions',
  noun: 'revision',
  entryType: 'decision-revision',
  load: (db, ids) => db.select().from(schema.decisionRevisions).where(inArray(schema.decisionRevisions.id, ids)),
  id: row => row.id,
  describe: row => `Revision ${row.revision} of decision ${row.decisionId}`,
  hash: revisionHash,
  subject: row => ({ type: 'decision', id: String(row.decisionId) }),
  selfCheck: row => canonicalHash(row.caseInput) === row.inputHash
    ? null
    : `Revision ${row.revision} of decision ${row.decisionId}: its case input no longer matches its input hash`,
}

const keySource: RecordSource<KeyRow> = {
  table: 'ledger_keys',
  noun: 'signing key',
  entryType: 'signing-key',
  load: (db, ids) => db.select().from(schema.ledgerKeys).where(inArray(schema.ledgerKeys.id, ids)),
  id: row => row.id,
  describe: row => `Signing key ${row.keyId}`,
  hash: signingKeyHash,
  subject: row => ({ type: 'signing-key', id: row.keyId }),
}

/**
 * The hash of a row's facts: every column but those set later, once (a review, a retraction), which
 * the decision's history records as events of their own. Empty (null) columns are left out, so a
 * nullable column added to a table later leaves its older rows' hashes as they were; a column added
 * with a value for every row changes them all (a migration adding one re-records nothing: avoid it).
 */
export function factsHash(row: Record<string, unknown>, setLater: readonly string[] = []) {
  return canonicalHash(Object.fromEntries(Object.entries(row)
    .filter(([column, value]) => value !== null && value !== undefined && !setLater.includes(column))
    .map(([column, value]) => [column, value instanceof Date ? value.toISOString() : value])))
}

const RETRACTION = ['retractedAt', 'retractedBy', 'retractionReason'] as const

/** A verification record of a decision (wall check, grid study, run): its facts, found by id. */
function verificationRecord<Row extends { id: number; decisionId: number }>(
  table: string, noun: string, entryType: string, setLater: readonly string[],
  load: (db: LedgerDbOrTx, ids: number[]) => Promise<Row[]>,
): RecordSource<Row> {
  return {
    table,
    noun,
    entryType,
    load,
    id: row => row.id,
    describe: row => `${noun[0]!.toUpperCase()}${noun.slice(1)} ${row.id} of decision ${row.decisionId}`,
    hash: row => factsHash(row, setLater),
    subject: row => ({ type: 'decision', id: String(row.decisionId) }),
  }
}

const calibrationSource: RecordSource<typeof schema.calibrationAdoptions.$inferSelect> = {
  table: 'calibration_adoptions',
  idColumn: 'version',
  noun: 'calibration adoption',
  entryType: 'calibration-adoption',
  load: (db, ids) => db.select().from(schema.calibrationAdoptions).where(inArray(schema.calibrationAdoptions.version, ids)),
  id: row => row.version,
  describe: row => `Calibration version ${row.version}`,
  hash: row => factsHash(row),
  subject: row => ({ type: 'calibration', id: String(row.version) }),
}

const settingsSource: RecordSource<typeof schema.teamSettings.$inferSelect> = {
  table: 'team_settings',
  noun: 'team setting',
  entryType: 'team-settings',
  load: (db, ids) => db.select().from(schema.teamSettings).where(inArray(schema.teamSettings.id, ids)),
  id: row => row.id,
  describe: row => `Team setting ${row.id}`,
  hash: row => factsHash(row),
  subject: row => ({ type: 'team-settings', id: String(row.id) }),
}

// The team's ruleset history (its own chain, server/utils/rulesets/history.ts): each installation
// and publication is also a ledger entry holding the event's chained hash, so a rewritten and
// rehashed ruleset history no longer matches the ledger.
const rulesetEventSource: RecordSource<typeof schema.rulesetEvents.$inferSelect> = {
  table: 'ruleset_events',
  noun: 'ruleset event',
  entryType: 'ruleset-event',
  load: (db, ids) => db.select().from(schema.rulesetEvents).where(inArray(schema.rulesetEvents.id, ids)),
  id: row => row.id,
  describe: row => `Ruleset event #${row.seq} (${row.type}) of ruleset version ${row.rulesetId}`,
  hash: row => row.hash,
  hashColumn: 'hash',
  subject: row => ({ type: 'ruleset-version', id: String(row.rulesetId) }),
}

/** Every table whose rows the ledger holds, by name. */
export const RECORD_SOURCES: Record<string, RecordSource> = {
  decision_events: eventSource,
  decision_revisions: revisionSource,
  ledger_keys: keySource,
  wall_checks: verificationRecord('wall_checks', 'wall check', 'wall-check', ['reviewAccepted', 'reviewedBy', 'reviewedAt', 'reviewComment', ...RETRACTION],
    (db, ids) => db.select().from(schema.wallChecks).where(inArray(schema.wallChecks.id, ids))),
  grid_studies: verificationRecord('grid_studies', 'grid study', 'grid-study', RETRACTION,
    (db, ids) => db.select().from(schema.gridStudies).where(inArray(schema.gridStudies.id, ids))),
  run_records: verificationRecord('run_records', 'run record', 'run-record', RETRACTION,
    (db, ids) => db.select().from(schema.runRecords).where(inArray(schema.runRecords.id, ids))),
  calibration_adoptions: calibrationSource,
  team_settings: settingsSource,
  ruleset_events: rulesetEventSource,
}

/** The ledger entry of a newly written row of one of RECORD_SOURCES' tables. */
export function ledgerEntryFor(table: keyof typeof RECORD_SOURCES, row: Record<string, unknown>): LedgerEntryInput {
  const source = RECORD_SOURCES[table]!
  const subject = source.subject(row)
  return {
    subjectType: subject.type,
    subjectId: subject.id,
    type: source.entryType,
    record: { table: source.table, id: source.id(row) },
    recordHash: source.hash(row),
  }
}

/** Appends a newly written row of one of RECORD_SOURCES' tables to the ledger, in the caller's transaction. */
export async function recordInLedger(tx: LedgerDbOrTx, table: keyof typeof RECORD_SOURCES, row: Record<string, unknown>) {
  await appendLedgerEntry(tx, ledgerEntryFor(table, row))
}

/** Inserts a stored revision and its ledger entry (and the ruleset it was advised under, the first time). */
export async function insertRevision(tx: LedgerDbOrTx, values: Omit<RevisionRow, 'id'>) {
  await recordRuleset(tx)
  const [row] = await tx.insert(schema.decisionRevisions).values(values).returning()
  await appendLedgerEntry(tx, {
    subjectType: 'decision',
    subjectId: row!.decisionId,
    type: 'decision-revision',
    record: { table: 'decision_revisions', id: row!.id },
    recordHash: revisionHash(row!),
  })
  return row!
}

// ---- rulesets: the rules behind every advice, held by content so a silent edit shows

export const rulesetSubject = (ruleset: { id: string; version: string } = RULESET) => `${ruleset.id}@${ruleset.version}`
export const rulesetHash = (ruleset: unknown = RULESET) => canonicalHash(ruleset)

/** Publishes the engine's ruleset version into the ledger once, the first time advice from it is stored. */
export async function recordRuleset(tx: LedgerDbOrTx) {
  const subject = rulesetSubject()
  // One indexed lookup per stored revision; the lock only when the version is new.
  const find = () => tx.select({ seq: schema.ledgerEntries.seq }).from(schema.ledgerEntries)
    .where(sql`${schema.ledgerEntries.subjectType} = 'ruleset' AND ${schema.ledgerEntries.subjectId} = ${subject}`).limit(1)
  if ((await find()).length) return
  await lockLedger(tx)
  if ((await find()).length) return
  await appendLedgerEntry(tx, { subjectType: 'ruleset', subjectId: subject, type: 'ruleset', recordHash: rulesetHash() })
}

// ---- signing keys

/** Lists a signing key's public half (once) with its ledger entry. */
export async function recordSigningKey(tx: LedgerDbOrTx, key: { keyId: string; publicKey: string }) {
  const find = () => tx.select().from(schema.ledgerKeys).where(eq(schema.ledgerKeys.keyId, key.keyId))
  let [known] = await find()
  if (known) return { row: known, added: false }
  await lockLedger(tx)
  ;[known] = await find()
  if (known) return { row: known, added: false }
  const [row] = await tx.insert(schema.ledgerKeys)
    .values({ keyId: key.keyId, algorithm: 'ed25519', publicKey: key.publicKey, createdAt: new Date() }).returning()
  await appendLedgerEntry(tx, {
    subjectType: 'signing-key',
    subjectId: row!.keyId,
    type: 'signing-key',
    record: { table: 'ledger_keys', id: row!.id },
    recordHash: signingKeyHash(row!),
  })
  return { row: row!, added: true }
}
