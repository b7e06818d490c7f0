-- A published ruleset is part of the record, like the decision history: once a version leaves
-- draft its rules, base scores, version and publication stay as they were, it is never deleted,
-- and its only change is published -> retired when a later version is published. Its canonical
-- cases are kept with it. The ruleset history is append-only. A reseed drops the schema instead.
CREATE FUNCTION guard_released_ruleset() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.status <> 'draft' THEN
      RAISE EXCEPTION 'ruleset % %: a % version is kept for good; DELETE refused', OLD.key, OLD.version, OLD.status
        USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.status = 'draft' THEN
    RETURN NEW;
  END IF;
  IF NEW.key IS DISTINCT FROM OLD.key OR NEW.version IS DISTINCT FROM OLD.version
    OR NEW.rules IS DISTINCT FROM OLD.rules OR NEW.base_scores IS DISTINCT FROM OLD.base_scores
    OR NEW.base_why IS DISTINCT FROM OLD.base_why OR NEW.note IS DISTINCT FROM OLD.note
    OR NEW.content_hash IS DISTINCT FROM OLD.content_hash OR NEW.based_on_id IS DISTINCT FROM OLD.based_on_id
    OR NEW.created_by IS DISTINCT FROM OLD.created_by OR NEW.created_at IS DISTINCT FROM OLD.created_at
    OR NEW.published_by IS DISTINCT FROM OLD.published_by OR NEW.published_at IS DISTINCT FROM OLD.published_at THEN
    RAISE EXCEPTION 'ruleset % % is %: its content is immutable; UPDATE refused', OLD.key, OLD.version, OLD.status
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF NEW.status IS DISTINCT FROM OLD.status AND NOT (OLD.status = 'published' AND NEW.status = 'retired') THEN
    RAISE EXCEPTION 'ruleset % % cannot go from % to %', OLD.key, OLD.version, OLD.status, NEW.status
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF OLD.status = 'retired' AND NEW.retired_at IS DISTINCT FROM OLD.retired_at THEN
    RAISE EXCEPTION 'ruleset % % is retired: UPDATE refused', OLD.key, OLD.version
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER rulesets_released_immutable BEFORE UPDATE OR DELETE ON rulesets
  FOR EACH ROW EXECUTE FUNCTION guard_released_ruleset();
--> statement-breakpoint
CREATE TRIGGER rulesets_no_truncate BEFORE TRUNCATE ON rulesets
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
-- Canonical cases change only while their ruleset is a draft (or while a draft is deleted).
CREATE FUNCTION guard_released_ruleset_cases() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  parent_status ruleset_status;
BEGIN
  SELECT status INTO parent_status FROM rulesets
    WHERE id = CASE WHEN TG_OP = 'DELETE' THEN OLD.ruleset_id ELSE NEW.ruleset_id END;
  IF parent_status IS NOT NULL AND parent_status <> 'draft' THEN
    RAISE EXCEPTION 'the canonical cases of a % ruleset are kept as published: % refused', parent_status, TG_OP
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF TG_OP = 'UPDATE' AND NEW.ruleset_id IS DISTINCT FROM OLD.ruleset_id THEN
    RAISE EXCEPTION 'a canonical case stays with its ruleset: UPDATE refused' USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER ruleset_cases_kept_with_release BEFORE INSERT OR UPDATE OR DELETE ON ruleset_cases
  FOR EACH ROW EXECUTE FUNCTION guard_released_ruleset_cases();
--> statement-breakpoint
CREATE TRIGGER ruleset_cases_no_truncate BEFORE TRUNCATE ON ruleset_cases
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ruleset_events_append_only BEFORE UPDATE OR DELETE ON ruleset_events
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ruleset_events_no_truncate BEFORE TRUNCATE ON ruleset_events
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
