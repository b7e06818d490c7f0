CREATE TABLE "decision_rule_tallies" (
	"month" date NOT NULL,
	"project_id" integer NOT NULL,
	"status" "decision_status" NOT NULL,
	"rule" text NOT NULL,
	"decisions" integer NOT NULL,
	CONSTRAINT "decision_rule_tallies_month_project_id_status_rule_pk" PRIMARY KEY("month","project_id","status","rule")
);
--> statement-breakpoint
CREATE TABLE "decision_ruleset_tallies" (
	"month" date NOT NULL,
	"project_id" integer NOT NULL,
	"status" "decision_status" NOT NULL,
	"ruleset_id" text NOT NULL,
	"ruleset_version" text NOT NULL,
	"decisions" integer NOT NULL,
	CONSTRAINT "decision_ruleset_tallies_month_project_id_status_ruleset_id_ruleset_version_pk" PRIMARY KEY("month","project_id","status","ruleset_id","ruleset_version")
);
--> statement-breakpoint
CREATE TABLE "decision_summaries" (
	"decision_id" integer PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"title" text NOT NULL,
	"status" "decision_status" NOT NULL,
	"version" integer NOT NULL,
	"revision" integer NOT NULL,
	"unit_system" "unit_system" NOT NULL,
	"author_id" integer NOT NULL,
	"reviewer_id" integer,
	"changes_requested_by" integer,
	"approach" text NOT NULL,
	"model" text NOT NULL,
	"wall_treatment" text NOT NULL,
	"engine_approach" text NOT NULL,
	"overridden" boolean NOT NULL,
	"override_reason" text,
	"disagreed_rules" text[] NOT NULL,
	"reynolds" double precision NOT NULL,
	"core_hours" double precision,
	"budget_core_hours" double precision NOT NULL,
	"ruleset_id" text NOT NULL,
	"ruleset_version" text NOT NULL,
	"engine_version" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	"submitted_at" timestamp with time zone,
	"reviewed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "decision_tallies" (
	"month" date NOT NULL,
	"project_id" integer NOT NULL,
	"status" "decision_status" NOT NULL,
	"approach" text NOT NULL,
	"model" text NOT NULL,
	"engine_approach" text NOT NULL,
	"overridden" boolean NOT NULL,
	"decisions" integer NOT NULL,
	"core_hours" numeric NOT NULL,
	"budget_core_hours" numeric NOT NULL,
	"over_budget" integer NOT NULL,
	CONSTRAINT "decision_tallies_month_project_id_status_approach_model_engine_approach_overridden_pk" PRIMARY KEY("month","project_id","status","approach","model","engine_approach","overridden")
);
--> statement-breakpoint
ALTER TABLE "decision_rule_tallies" ADD CONSTRAINT "decision_rule_tallies_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_ruleset_tallies" ADD CONSTRAINT "decision_ruleset_tallies_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_summaries" ADD CONSTRAINT "decision_summaries_decision_id_decisions_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_summaries" ADD CONSTRAINT "decision_summaries_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_summaries" ADD CONSTRAINT "decision_summaries_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_summaries" ADD CONSTRAINT "decision_summaries_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_summaries" ADD CONSTRAINT "decision_summaries_changes_requested_by_users_id_fk" FOREIGN KEY ("changes_requested_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_tallies" ADD CONSTRAINT "decision_tallies_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "decision_rule_tallies_project_idx" ON "decision_rule_tallies" USING btree ("project_id","month");--> statement-breakpoint
CREATE INDEX "decision_ruleset_tallies_project_idx" ON "decision_ruleset_tallies" USING btree ("project_id","month");--> statement-breakpoint
CREATE INDEX "decision_summaries_updated_idx" ON "decision_summaries" USING btree ("updated_at","decision_id");--> statement-breakpoint
CREATE INDEX "decision_summaries_project_updated_idx" ON "decision_summaries" USING btree ("project_id","updated_at","decision_id");--> statement-breakpoint
CREATE INDEX "decision_summaries_status_updated_idx" ON "decision_summaries" USING btree ("status","updated_at","decision_id");--> statement-breakpoint
CREATE INDEX "decision_summaries_project_status_updated_idx" ON "decision_summaries" USING btree ("project_id","status","updated_at","decision_id");--> statement-breakpoint
CREATE INDEX "decision_summaries_queue_idx" ON "decision_summaries" USING btree ("submitted_at","decision_id","project_id","author_id") WHERE "decision_summaries"."status" = 'in_review';--> statement-breakpoint
CREATE INDEX "decision_summaries_author_updated_idx" ON "decision_summaries" USING btree ("author_id","updated_at","decision_id");--> statement-breakpoint
CREATE INDEX "decision_summaries_created_idx" ON "decision_summaries" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "decision_summaries_project_created_idx" ON "decision_summaries" USING btree ("project_id","created_at");--> statement-breakpoint
CREATE INDEX "decision_summaries_overridden_created_idx" ON "decision_summaries" USING btree ("created_at") WHERE "decision_summaries"."overridden";--> statement-breakpoint
CREATE INDEX "decision_tallies_project_idx" ON "decision_tallies" USING btree ("project_id","month");