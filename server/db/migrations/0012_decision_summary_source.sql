-- Decision summaries and the overview's tallies are derived from the record, in one place each:
--   decision_summary_source  what each decision stands for (the reviewer's override, else the
--                            engineer's requested choice, else the engine's), its cost and budget,
--                            versions, the times, reviewer and sender-back its events give;
--   write_decision_summaries rewrites the summaries of some decisions from it (the server calls it
--                            in the transaction of every change: server/utils/decisions/summary.ts);
--   tally_decision_summary   keeps decision_tallies and decision_rule_tallies in step with every
--                            summary written, in the same transaction.
-- Both functions run with their owner's rights, so an application role needs only EXECUTE and
-- SELECT: it cannot write a summary or a tally that the record does not give.
CREATE VIEW decision_summary_source AS
SELECT
  d.id AS decision_id,
  d.project_id,
  d.title,
  d.status,
  d.version,
  d.current_revision AS revision,
  d.unit_system,
  d.author_id,
  closing.actor_id AS reviewer_id,
  CASE WHEN last_step.type = 'changes_requested' THEN last_step.actor_id END AS changes_requested_by,
  chosen.approach,
  coalesce(d.override->>'model', entry.value->>'model', rec.value->>'model') AS model,
  coalesce(d.override->>'wallTreatment', r.requested->'figures'->>'wallTreatment', rec.value->>'wallTreatment') AS wall_treatment,
  rec.value->>'approach' AS engine_approach,
  d.override IS NOT NULL AS overridden,
  d.override->>'comment' AS override_reason,
  ARRAY(SELECT jsonb_array_elements_text(coalesce(d.override->'disagreedRules', '[]'::jsonb))) AS disagreed_rules,
  (r.advice->>'reynolds')::float8 AS reynolds,
  CASE
    WHEN d.override IS NOT NULL THEN coalesce((d.override->'cost'->>'coreHours')::float8, (entry.value->>'coreHours')::float8)
    WHEN r.requested IS NOT NULL THEN (r.requested->'figures'->'cost'->>'coreHours')::float8
    ELSE (entry.value->>'coreHours')::float8
  END AS core_hours,
  (r.case_input->'budget'->>'coreHours')::float8 AS budget_core_hours,
  r.ruleset_id,
  r.ruleset_version,
  r.engine_version,
  d.created_at,
  d.updated_at,
  (SELECT max(e.created_at) FROM decision_events e WHERE e.decision_id = d.id AND e.type = 'submitted') AS submitted_at,
  closing.created_at AS reviewed_at
FROM decisions d
JOIN decision_revisions r ON r.decision_id = d.id AND r.revision = d.current_revision
CROSS JOIN LATERAL (SELECT r.advice->'recommendation' AS value) rec
-- What the decision stands for: the reviewer's override, else the engineer's requested choice, else the engine's.
CROSS JOIN LATERAL (SELECT coalesce(d.override->>'approach', r.requested->'figures'->>'approach', rec.value->>'approach') AS approach) chosen
LEFT JOIN LATERAL (SELECT a AS value FROM jsonb_array_elements(r.advice->'approaches') a WHERE a->>'id' = chosen.approach LIMIT 1) entry ON true
LEFT JOIN LATERAL (
  SELECT e.actor_id, e.created_at FROM decision_events e
  WHERE e.decision_id = d.id AND e.type IN ('approved', 'overridden')
  ORDER BY e.seq DESC LIMIT 1
) closing ON true
-- A draft sent back reads differently while that is the last thing that happened to it (comments aside).
LEFT JOIN LATERAL (
  SELECT e.type, e.actor_id FROM decision_events e
  WHERE e.decision_id = d.id AND e.type <> 'commented'
  ORDER BY e.seq DESC LIMIT 1
) last_step ON true;
--> statement-breakpoint
CREATE FUNCTION write_decision_summaries(ids integer[]) RETURNS void
LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
  INSERT INTO decision_summaries (
    decision_id, project_id, title, status, version, revision, unit_system, author_id, reviewer_id, changes_requested_by, approach, model, wall_treatment,
    engine_approach, overridden, override_reason, disagreed_rules, reynolds, core_hours, budget_core_hours,
    ruleset_id, ruleset_version, engine_version, created_at, updated_at, submitted_at, reviewed_at
  )
  SELECT
    decision_id, project_id, title, status, version, revision, unit_system, author_id, reviewer_id, changes_requested_by, approach, model, wall_treatment,
    engine_approach, overridden, override_reason, disagreed_rules, reynolds, core_hours, budget_core_hours,
    ruleset_id, ruleset_version, engine_version, created_at, updated_at, submitted_at, reviewed_at
  FROM decision_summary_source WHERE decision_id = ANY(ids)
  ORDER BY decision_id
  ON CONFLICT (decision_id) DO UPDATE SET (
    project_id, title, status, version, revision, unit_system, author_id, reviewer_id, changes_requested_by, approach, model, wall_treatment,
    engine_approach, overridden, override_reason, disagreed_rules, reynolds, core_hours, budget_core_hours,
    ruleset_id, ruleset_version, engine_version, created_at, updated_at, submitted_at, reviewed_at
  ) = ROW(
    excluded.project_id, excluded.title, excluded.status, excluded.version, excluded.revision, excluded.unit_system, excluded.author_id,
    excluded.reviewer_id, excluded.changes_requested_by, excluded.approach, excluded.model, excluded.wall_treatment, excluded.engine_approach,
    excluded.overridden, excluded.override_reason, excluded.disagreed_rules, excluded.reynolds, excluded.core_hours,
    excluded.budget_core_hours, excluded.ruleset_id, excluded.ruleset_version, excluded.engine_version,
    excluded.created_at, excluded.updated_at, excluded.submitted_at, excluded.reviewed_at
  )
$$;
--> statement-breakpoint
-- A summary's share of the tallies: +1 for the row as it now is, -1 for the row it replaced.
-- Deltas are summed per key and applied in key order, so two transactions meet the same rows in
-- the same order (no deadlock) and a row a change leaves in its group nets to nothing.
CREATE FUNCTION tally_decision_summary() RETURNS trigger
LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
BEGIN
  INSERT INTO decision_tallies AS t (month, project_id, status, approach, model, engine_approach, overridden, decisions, core_hours, budget_core_hours, over_budget)
  SELECT month, project_id, status, approach, model, engine_approach, overridden, sum(n), sum(n * core_hours), sum(n * budget_core_hours), sum(n * over_budget)
  FROM (
    SELECT date_trunc('month', s.created_at AT TIME ZONE 'UTC')::date AS month, s.project_id, s.status, s.approach, s.model,
      s.engine_approach, s.overridden, d.n, coalesce(s.core_hours, 0)::numeric AS core_hours, s.budget_core_hours::numeric AS budget_core_hours,
      coalesce((s.core_hours > s.budget_core_hours)::int, 0) AS over_budget
    FROM (SELECT NEW.*) s, (VALUES (1)) d(n) WHERE TG_OP IN ('INSERT', 'UPDATE')
    UNION ALL
    SELECT date_trunc('month', s.created_at AT TIME ZONE 'UTC')::date, s.project_id, s.status, s.approach, s.model,
      s.engine_approach, s.overridden, d.n, coalesce(s.core_hours, 0)::numeric, s.budget_core_hours::numeric,
      coalesce((s.core_hours > s.budget_core_hours)::int, 0)
    FROM (SELECT OLD.*) s, (VALUES (-1)) d(n) WHERE TG_OP = 'UPDATE'
  ) delta
  GROUP BY month, project_id, status, approach, model, engine_approach, overridden
  HAVING sum(n) <> 0 OR sum(n * core_hours) <> 0 OR sum(n * budget_core_hours) <> 0
  ORDER BY month, project_id, status, approach, model, engine_approach, overridden
  ON CONFLICT (month, project_id, status, approach, model, engine_approach, overridden) DO UPDATE SET
    decisions = t.decisions + excluded.decisions,
    core_hours = t.core_hours + excluded.core_hours,
    budget_core_hours = t.budget_core_hours + excluded.budget_core_hours,
    over_budget = t.over_budget + excluded.over_budget;

  INSERT INTO decision_rule_tallies AS t (month, project_id, status, rule, decisions)
  SELECT month, project_id, status, rule, sum(n)
  FROM (
    SELECT date_trunc('month', NEW.created_at AT TIME ZONE 'UTC')::date AS month, NEW.project_id AS project_id, NEW.status AS status, rule, 1 AS n
    FROM unnest(NEW.disagreed_rules) AS rule WHERE TG_OP IN ('INSERT', 'UPDATE')
    UNION ALL
    SELECT date_trunc('month', OLD.created_at AT TIME ZONE 'UTC')::date, OLD.project_id, OLD.status, rule, -1
    FROM unnest(OLD.disagreed_rules) AS rule WHERE TG_OP = 'UPDATE'
  ) delta
  GROUP BY month, project_id, status, rule
  HAVING sum(n) <> 0
  ORDER BY month, project_id, status, rule
  ON CONFLICT (month, project_id, status, rule) DO UPDATE SET decisions = t.decisions + excluded.decisions;

  INSERT INTO decision_ruleset_tallies AS t (month, project_id, status, ruleset_id, ruleset_version, decisions)
  SELECT month, project_id, status, ruleset_id, ruleset_version, sum(n)
  FROM (
    SELECT date_trunc('month', NEW.created_at AT TIME ZONE 'UTC')::date AS month, NEW.project_id AS project_id, NEW.status AS status,
      NEW.ruleset_id AS ruleset_id, NEW.ruleset_version AS ruleset_version, 1 AS n WHERE TG_OP IN ('INSERT', 'UPDATE')
    UNION ALL
    SELECT date_trunc('month', OLD.created_at AT TIME ZONE 'UTC')::date, OLD.project_id, OLD.status, OLD.ruleset_id, OLD.ruleset_version, -1
    WHERE TG_OP = 'UPDATE'
  ) delta
  GROUP BY month, project_id, status, ruleset_id, ruleset_version
  HAVING sum(n) <> 0
  ORDER BY month, project_id, status, ruleset_id, ruleset_version
  ON CONFLICT (month, project_id, status, ruleset_id, ruleset_version) DO UPDATE SET decisions = t.decisions + excluded.decisions;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER decision_summaries_tally AFTER INSERT OR UPDATE ON decision_summaries
  FOR EACH ROW EXECUTE FUNCTION tally_decision_summary();
--> statement-breakpoint
-- Summaries and tallies change with their decisions but are never removed, as the history they summarise.
CREATE FUNCTION refuse_summary_removal() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% summarises the append-only history: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER decision_summaries_no_delete BEFORE DELETE ON decision_summaries
  FOR EACH ROW EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_summaries_no_truncate BEFORE TRUNCATE ON decision_summaries
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_tallies_no_delete BEFORE DELETE ON decision_tallies
  FOR EACH ROW EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_tallies_no_truncate BEFORE TRUNCATE ON decision_tallies
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_rule_tallies_no_delete BEFORE DELETE ON decision_rule_tallies
  FOR EACH ROW EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_rule_tallies_no_truncate BEFORE TRUNCATE ON decision_rule_tallies
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_ruleset_tallies_no_delete BEFORE DELETE ON decision_ruleset_tallies
  FOR EACH ROW EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
CREATE TRIGGER decision_ruleset_tallies_no_truncate BEFORE TRUNCATE ON decision_ruleset_tallies
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_summary_removal();
--> statement-breakpoint
-- Search by title: trigram index (pg_trgm ships with PostgreSQL and is trusted, so the database
-- owner may create it).
CREATE EXTENSION IF NOT EXISTS pg_trgm;
--> statement-breakpoint
CREATE INDEX decision_summaries_title_trgm_idx ON decision_summaries USING gin (title gin_trgm_ops);
--> statement-breakpoint
-- Decisions recorded before summaries existed (their tallies follow through the trigger).
SELECT write_decision_summaries(ARRAY(SELECT id FROM decisions));
