-- The server connects as a member of eddyledger_app, never as the owner that runs these
-- migrations: only the owner may ALTER a table or switch its triggers off, so the server's own
-- credentials cannot undo the append-only rules. The set-up scripts create the roles (README,
-- "Database roles"); without eddyledger_app (a single-role install) the grants are skipped with a
-- warning and the server keeps the owner's rights.
DO $$
BEGIN
  IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = 'eddyledger_app') THEN
    BEGIN
      CREATE ROLE eddyledger_app NOLOGIN;
    EXCEPTION WHEN insufficient_privilege THEN
      RAISE WARNING 'role eddyledger_app does not exist and % may not create it: the server keeps the owner''s rights', current_user;
      RETURN;
    END;
  END IF;
  -- Operational tables: read and write. Tables created by later migrations get the same by default
  -- (a history table's migration revokes UPDATE and DELETE again, see DEVELOPERS.md).
  GRANT USAGE ON SCHEMA public TO eddyledger_app;
  GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO eddyledger_app;
  GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO eddyledger_app;
  ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO eddyledger_app;
  ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO eddyledger_app;
  -- History and ledger: read and append only.
  REVOKE UPDATE, DELETE, TRUNCATE ON decision_events, decision_revisions, ledger_entries, ledger_keys,
    ledger_checkpoints, ledger_verifications, ruleset_events FROM eddyledger_app;
  -- Decisions are never deleted, and only the columns the workflow writes may change (the status,
  -- override, title and revision only with their event: decisions_state_follows_history).
  REVOKE UPDATE, DELETE, TRUNCATE ON decisions FROM eddyledger_app;
  GRANT UPDATE (title, status, version, current_revision, override, superseded_by_id, unit_system, updated_at) ON decisions TO eddyledger_app;
  -- Verification records keep their facts (keep_verification_record, 0003): only the columns set
  -- later, once (a review, a retraction), may be written; calibrations and settings are appended.
  REVOKE UPDATE, DELETE, TRUNCATE ON wall_checks, grid_studies, run_records, calibration_adoptions, team_settings FROM eddyledger_app;
  GRANT UPDATE (review_accepted, reviewed_by, reviewed_at, review_comment, retracted_at, retracted_by, retraction_reason) ON wall_checks TO eddyledger_app;
  GRANT UPDATE (retracted_at, retracted_by, retraction_reason) ON grid_studies, run_records TO eddyledger_app;
END;
$$;
