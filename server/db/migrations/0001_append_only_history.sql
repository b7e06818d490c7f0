-- Decision history is append-only at the database: no UPDATE, DELETE or TRUNCATE of events or
-- stored revisions, whatever the application does. A reseed drops the schema instead.
CREATE FUNCTION refuse_history_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER decision_events_append_only BEFORE UPDATE OR DELETE ON decision_events
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER decision_events_no_truncate BEFORE TRUNCATE ON decision_events
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER decision_revisions_append_only BEFORE UPDATE OR DELETE ON decision_revisions
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER decision_revisions_no_truncate BEFORE TRUNCATE ON decision_revisions
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
