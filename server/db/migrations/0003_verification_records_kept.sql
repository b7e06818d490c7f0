-- Verification records are never deleted. Their facts (the file, its hash, the figures) never
-- change; the columns named as trigger arguments (a review, a retraction) may be set once, from
-- NULL to a value, and then stay. Adoptions of the calibration and team settings are append-only.
CREATE FUNCTION keep_verification_record() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  settable text[] := TG_ARGV;
  col text;
BEGIN
  IF TG_OP <> 'UPDATE' THEN
    RAISE EXCEPTION '% keeps every record: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF (to_jsonb(NEW) - settable) IS DISTINCT FROM (to_jsonb(OLD) - settable) THEN
    RAISE EXCEPTION '% keeps its recorded facts: only % may be set', TG_TABLE_NAME, array_to_string(settable, ', ') USING ERRCODE = 'insufficient_privilege';
  END IF;
  FOREACH col IN ARRAY settable LOOP
    IF (to_jsonb(OLD) -> col) IS DISTINCT FROM 'null'::jsonb AND (to_jsonb(NEW) -> col) IS DISTINCT FROM (to_jsonb(OLD) -> col) THEN
      RAISE EXCEPTION '%.% is set once and stays', TG_TABLE_NAME, col USING ERRCODE = 'insufficient_privilege';
    END IF;
  END LOOP;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER wall_checks_kept BEFORE UPDATE OR DELETE ON wall_checks
  FOR EACH ROW EXECUTE FUNCTION keep_verification_record('review_accepted', 'reviewed_by', 'reviewed_at', 'review_comment', 'retracted_at', 'retracted_by', 'retraction_reason');
--> statement-breakpoint
CREATE TRIGGER grid_studies_kept BEFORE UPDATE OR DELETE ON grid_studies
  FOR EACH ROW EXECUTE FUNCTION keep_verification_record('retracted_at', 'retracted_by', 'retraction_reason');
--> statement-breakpoint
CREATE TRIGGER run_records_kept BEFORE UPDATE OR DELETE ON run_records
  FOR EACH ROW EXECUTE FUNCTION keep_verification_record('retracted_at', 'retracted_by', 'retraction_reason');
--> statement-breakpoint
CREATE TRIGGER calibration_adoptions_append_only BEFORE UPDATE OR DELETE ON calibration_adoptions
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER team_settings_append_only BEFORE UPDATE OR DELETE ON team_settings
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER verification_no_truncate BEFORE TRUNCATE ON wall_checks
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER verification_no_truncate BEFORE TRUNCATE ON grid_studies
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER verification_no_truncate BEFORE TRUNCATE ON run_records
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER verification_no_truncate BEFORE TRUNCATE ON calibration_adoptions
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER verification_no_truncate BEFORE TRUNCATE ON team_settings
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
