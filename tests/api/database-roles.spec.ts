// The server's own database credentials (DATABASE_URL, the app role) against the history: they
// read and append, and nothing else. Only the owner that runs the migrations may switch a trigger
// off, which is why the ledger is also verified from its hashes and signatures.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { signIn } from '../support/api-client'
import { createDraft, projectIds } from '../support/decisions'

// Each history table with one of its columns, for an UPDATE that would change nothing yet is refused.
const HISTORY_COLUMN: Record<string, string> = {
  decision_events: 'payload', decision_revisions: 'advice', ledger_entries: 'hash', ledger_keys: 'public_key',
  ledger_checkpoints: 'signature', ledger_verifications: 'problems',
  // Verification records: the facts (their review and retraction columns are set once, by trigger).
  wall_checks: 'sha256', grid_studies: 'result', run_records: 'core_hours', calibration_adoptions: 'entries', team_settings: 'wall_check_pass_fraction',
}
const HISTORY = Object.keys(HISTORY_COLUMN)
let app: pg.Client
let owner: pg.Client
let draftId: number

beforeAll(async () => {
  app = new pg.Client({ connectionString: inject('databaseAppUrl') })
  owner = new pg.Client({ connectionString: inject('databaseOwnerUrl') })
  await Promise.all([app.connect(), owner.connect()])
  const engineer = await signIn('engineer')
  draftId = (await createDraft(engineer, (await projectIds(engineer))['KB-101']!)).id
})

afterAll(async () => {
  await Promise.all([app?.end(), owner?.end()])
})

describe('the server\'s role', () => {
  it('is the one the server logs in with, owns no table and is no superuser', async () => {
    const { rows: [me] } = await app.query(`
      SELECT current_user AS name, r.rolsuper, r.rolcreaterole, r.rolbypassrls,
        (SELECT count(*)::int FROM pg_tables WHERE schemaname = 'public' AND tableowner = current_user) AS owned
      FROM pg_roles r WHERE r.rolname = current_user`)
    expect(me).toEqual({ name: 'eddyledger', rolsuper: false, rolcreaterole: false, rolbypassrls: false, owned: 0 })
    expect((await app.query('SELECT count(*)::int AS n FROM ledger_entries')).rows[0].n).toBeGreaterThan(0)
  })

  it.each(HISTORY)('cannot switch off the triggers of %s, alter it, or change its rows', async (table) => {
    await expect(app.query(`ALTER TABLE ${table} DISABLE TRIGGER USER`)).rejects.toThrow(/must be owner of table/)
    await expect(app.query(`ALTER TABLE ${table} DISABLE TRIGGER ALL`)).rejects.toThrow(/must be owner of table/)
    await expect(app.query(`ALTER TABLE ${table} ADD COLUMN note text`)).rejects.toThrow(/must be owner of table/)
    await expect(app.query(`DROP TABLE ${table}`)).rejects.toThrow(/must be owner of table/)
    await expect(app.query(`UPDATE ${table} SET ${HISTORY_COLUMN[table]} = ${HISTORY_COLUMN[table]}`)).rejects.toThrow(/permission denied for table/)
    await expect(app.query(`DELETE FROM ${table}`)).rejects.toThrow(/permission denied for table/)
    await expect(app.query(`TRUNCATE ${table}`)).rejects.toThrow(/permission denied for table/)
  })

  it('cannot drop the append-only triggers, nor switch triggers off for its session', async () => {
    await expect(app.query('DROP TRIGGER decision_events_append_only ON decision_events')).rejects.toThrow(/must be owner of (table|relation)/)
    await expect(app.query('DROP FUNCTION refuse_history_change() CASCADE')).rejects.toThrow(/must be owner of function/)
    await expect(app.query('SET session_replication_role = replica')).rejects.toThrow(/permission denied to set parameter/)
  })

  it('cannot create objects of its own in the schema', async () => {
    await expect(app.query('CREATE TABLE shadow_events (id int)')).rejects.toThrow(/permission denied for schema public/)
    await expect(app.query('CREATE FUNCTION refuse_nothing() RETURNS int LANGUAGE sql AS $$ SELECT 1 $$')).rejects.toThrow(/permission denied for schema public/)
  })

  it('cannot delete a decision, nor change the columns no workflow writes', async () => {
    await expect(app.query('DELETE FROM decisions WHERE id = $1', [draftId])).rejects.toThrow(/permission denied for table decisions/)
    await expect(app.query('UPDATE decisions SET author_id = author_id WHERE id = $1', [draftId])).rejects.toThrow(/permission denied for table decisions/)
    await expect(app.query('UPDATE decisions SET project_id = project_id WHERE id = $1', [draftId])).rejects.toThrow(/permission denied for table decisions/)
  })

  it('cannot change a decision\'s status, override or revision without the event that records it', async () => {
    await expect(app.query(`UPDATE decisions SET status = 'approved' WHERE id = $1`, [draftId]))
      .rejects.toThrow(`decision ${draftId}: its status is approved but its history says draft`)
    await expect(app.query(`UPDATE decisions SET override = '{"approach":"dns"}' WHERE id = $1`, [draftId]))
      .rejects.toThrow(`decision ${draftId}: it holds an override its history never recorded`)
    await expect(app.query('UPDATE decisions SET current_revision = 2 WHERE id = $1', [draftId]))
      .rejects.toThrow(`decision ${draftId}: its current revision is 2 but its history says 1`)
    // What the workflow writes with no event of its own still goes through.
    await app.query('UPDATE decisions SET version = version, updated_at = now() WHERE id = $1', [draftId])
    expect((await app.query('SELECT status FROM decisions WHERE id = $1', [draftId])).rows[0].status).toBe('draft')
  })
})

describe('the owner', () => {
  it('can switch a trigger off (so the tamper tests are real), which the server cannot', async () => {
    await owner.query('BEGIN')
    await owner.query('ALTER TABLE decision_events DISABLE TRIGGER decision_events_append_only')
    await owner.query('ROLLBACK')
  })

  it('gives tables that later migrations create the server\'s read and write rights by default', async () => {
    await owner.query('BEGIN')
    try {
      await owner.query('CREATE TABLE later_summary (id serial PRIMARY KEY, figure int)')
      const { rows: [rights] } = await owner.query(`SELECT
        has_table_privilege('eddyledger', 'later_summary', 'SELECT') AS "select", has_table_privilege('eddyledger', 'later_summary', 'INSERT') AS "insert",
        has_table_privilege('eddyledger', 'later_summary', 'UPDATE') AS "update", has_table_privilege('eddyledger', 'later_summary', 'TRUNCATE') AS "truncate",
        has_sequence_privilege('eddyledger', 'later_summary_id_seq', 'USAGE') AS "sequence"`)
      expect(rights).toEqual({ select: true, insert: true, update: true, truncate: false, sequence: true })
    } finally {
      await owner.query('ROLLBACK')
    }
  })
})
