-- The ledger's tables are append-only like the decision history (refuse_history_change, 0001).
CREATE TRIGGER ledger_entries_append_only BEFORE UPDATE OR DELETE ON ledger_entries
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_entries_no_truncate BEFORE TRUNCATE ON ledger_entries
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_keys_append_only BEFORE UPDATE OR DELETE ON ledger_keys
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_keys_no_truncate BEFORE TRUNCATE ON ledger_keys
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_checkpoints_append_only BEFORE UPDATE OR DELETE ON ledger_checkpoints
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_checkpoints_no_truncate BEFORE TRUNCATE ON ledger_checkpoints
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_verifications_append_only BEFORE UPDATE OR DELETE ON ledger_verifications
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER ledger_verifications_no_truncate BEFORE TRUNCATE ON ledger_verifications
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
-- What a decision's history says its row must hold, by replaying its events in order: the last
-- state-changing event gives the status, the last created/revised event the current revision and
-- title, the last override event the override. A new event type that changes a decision's row
-- must be added here (and is otherwise treated as changing nothing, like a comment).
-- A function of the decisions asked for (every one when ids is NULL), so that a check of a page of
-- decisions reads only their events: the planner inlines it, and the views below are the whole set.
CREATE FUNCTION decision_history_state_of(ids int[]) RETURNS TABLE (
  decision_id int, events int, status decision_status, current_revision int, title text, supersedes int,
  superseded_by int, override_payload jsonb, override_actor int
) LANGUAGE sql STABLE AS $$
SELECT
  e.decision_id,
  count(*)::int AS events,
  (array_agg(CASE e.type
      WHEN 'submitted' THEN 'in_review'
      WHEN 'approved' THEN 'approved'
      WHEN 'overridden' THEN 'overridden'
      WHEN 'superseded' THEN 'superseded'
      ELSE 'draft' END ORDER BY e.seq DESC)
    FILTER (WHERE e.type IN ('created', 'revised', 'changes_requested', 'submitted', 'approved', 'overridden', 'superseded'))
  )[1]::decision_status AS status,
  (array_agg((e.payload->>'revision')::int ORDER BY e.seq DESC) FILTER (WHERE e.type IN ('created', 'revised')))[1] AS current_revision,
  (array_agg(e.payload->>'title' ORDER BY e.seq DESC) FILTER (WHERE e.type IN ('created', 'revised') AND e.payload ? 'title'))[1] AS title,
  (array_agg((e.payload->>'supersedes')::int) FILTER (WHERE e.type = 'created'))[1] AS supersedes,
  (array_agg((e.payload->>'supersededBy')::int ORDER BY e.seq DESC) FILTER (WHERE e.type = 'superseded'))[1] AS superseded_by,
  (array_agg(e.payload ORDER BY e.seq DESC) FILTER (WHERE e.type = 'overridden'))[1] AS override_payload,
  (array_agg(e.actor_id ORDER BY e.seq DESC) FILTER (WHERE e.type = 'overridden'))[1] AS override_actor
FROM decision_events e
WHERE ids IS NULL OR e.decision_id = ANY(ids)
GROUP BY e.decision_id
$$;
--> statement-breakpoint
CREATE VIEW decision_history_state AS SELECT * FROM decision_history_state_of(NULL);
--> statement-breakpoint
-- An override event holds the whole override as stored (payload.override: the reviewer's choice,
-- the near-wall figures and cost for it, the reviewer). Events recorded before it held the whole
-- override carried the choice only: then every field they recorded must match, and the reviewer
-- must be the event's actor.
CREATE FUNCTION decision_override_matches(stored jsonb, payload jsonb, actor integer) RETURNS boolean
LANGUAGE plpgsql IMMUTABLE AS $$
BEGIN
  IF stored = 'null'::jsonb THEN stored := NULL; END IF;
  IF payload IS NULL THEN RETURN stored IS NULL; END IF;
  IF stored IS NULL THEN RETURN false; END IF;
  IF payload ? 'override' THEN RETURN stored = payload->'override'; END IF;
  RETURN (stored->'reviewer'->>'id')::int IS NOT DISTINCT FROM actor
    AND stored @> (payload - 'recommended' - 'coreHours');
END;
$$;
--> statement-breakpoint
-- Each decision beside what its history says; mismatch is null when they agree.
CREATE FUNCTION decision_state_check_of(ids int[]) RETURNS TABLE (decision_id int, events int, mismatch text)
LANGUAGE sql STABLE AS $$
SELECT
  d.id AS decision_id,
  coalesce(s.events, 0) AS events,
  CASE WHEN s.decision_id IS NULL THEN 'it has no recorded history'
  ELSE nullif(concat_ws('; ',
    CASE WHEN d.status IS DISTINCT FROM s.status
      THEN format('its status is %s but its history says %s', d.status, coalesce(s.status::text, 'nothing')) END,
    CASE WHEN d.current_revision IS DISTINCT FROM s.current_revision
      THEN format('its current revision is %s but its history says %s', d.current_revision, coalesce(s.current_revision::text, 'none')) END,
    CASE WHEN s.title IS NOT NULL AND d.title IS DISTINCT FROM s.title
      THEN 'its title differs from the one its history recorded' END,
    CASE WHEN d.supersedes_id IS DISTINCT FROM s.supersedes
      THEN format('it claims to supersede %s but its history says %s', coalesce(d.supersedes_id::text, 'nothing'), coalesce(s.supersedes::text, 'nothing')) END,
    CASE WHEN d.superseded_by_id IS DISTINCT FROM s.superseded_by
      THEN format('it claims to be superseded by %s but its history says %s', coalesce(d.superseded_by_id::text, 'nothing'), coalesce(s.superseded_by::text, 'nothing')) END,
    CASE WHEN NOT decision_override_matches(d.override, s.override_payload, s.override_actor)
      THEN CASE WHEN s.override_payload IS NULL THEN 'it holds an override its history never recorded'
        ELSE 'its override differs from the one its history recorded' END END
  ), '') END AS mismatch
FROM decisions d
LEFT JOIN decision_history_state_of(ids) s ON s.decision_id = d.id
WHERE ids IS NULL OR d.id = ANY(ids)
$$;
--> statement-breakpoint
CREATE VIEW decision_state_check AS SELECT * FROM decision_state_check_of(NULL);
--> statement-breakpoint
-- The columns the events decide change only with the event that records the change: checked at
-- commit, when the transaction's event is in. Whoever may switch this off (the owner) is caught by
-- the ledger verification instead, which reads the same view.
CREATE FUNCTION decision_state_follows_history() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  problem text;
BEGIN
  SELECT c.mismatch INTO problem FROM decision_state_check_of(ARRAY[NEW.id]) c;
  IF problem IS NOT NULL THEN
    RAISE EXCEPTION 'decision %: %', NEW.id, problem USING
      ERRCODE = 'integrity_constraint_violation',
      HINT = 'A decision''s status, override, title and revision change only together with the event that records the change.';
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER decisions_state_follows_history AFTER INSERT OR UPDATE ON decisions
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION decision_state_follows_history();
--> statement-breakpoint
-- No decision is ever deleted: a closed one is superseded instead.
CREATE TRIGGER decisions_no_delete BEFORE DELETE ON decisions
  FOR EACH ROW EXECUTE FUNCTION refuse_history_change();
--> statement-breakpoint
CREATE TRIGGER decisions_no_truncate BEFORE TRUNCATE ON decisions
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_history_change();
