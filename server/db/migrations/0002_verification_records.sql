ALTER TYPE "public"."decision_event_type" ADD VALUE 'wall_check_uploaded';--> statement-breakpoint
ALTER TYPE "public"."decision_event_type" ADD VALUE 'wall_check_reviewed';--> statement-breakpoint
ALTER TYPE "public"."decision_event_type" ADD VALUE 'grid_study_recorded';--> statement-breakpoint
ALTER TYPE "public"."decision_event_type" ADD VALUE 'run_recorded';--> statement-breakpoint
ALTER TYPE "public"."decision_event_type" ADD VALUE 'verification_retracted';--> statement-breakpoint
CREATE TABLE "calibration_adoptions" (
	"version" serial PRIMARY KEY NOT NULL,
	"adopted_by" integer NOT NULL,
	"entries" jsonb NOT NULL,
	"run_ids" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "grid_studies" (
	"id" serial PRIMARY KEY NOT NULL,
	"decision_id" integer NOT NULL,
	"created_by" integer NOT NULL,
	"quantity" text NOT NULL,
	"unit" text DEFAULT '' NOT NULL,
	"dimensions" integer NOT NULL,
	"grids" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"retracted_at" timestamp with time zone,
	"retracted_by" integer,
	"retraction_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "run_records" (
	"id" serial PRIMARY KEY NOT NULL,
	"decision_id" integer NOT NULL,
	"created_by" integer NOT NULL,
	"approach" text NOT NULL,
	"cells" double precision NOT NULL,
	"time_steps" double precision NOT NULL,
	"inner_iterations" integer,
	"core_hours" double precision NOT NULL,
	"wall_clock_hours" double precision NOT NULL,
	"cores" integer NOT NULL,
	"hardware" text NOT NULL,
	"hardware_note" text DEFAULT '' NOT NULL,
	"solver_family" text DEFAULT '' NOT NULL,
	"estimated" jsonb,
	"retracted_at" timestamp with time zone,
	"retracted_by" integer,
	"retraction_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "team_settings" (
	"id" serial PRIMARY KEY NOT NULL,
	"wall_check_pass_fraction" double precision NOT NULL,
	"set_by" integer NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wall_checks" (
	"id" serial PRIMARY KEY NOT NULL,
	"decision_id" integer NOT NULL,
	"uploaded_by" integer NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"compressed" boolean NOT NULL,
	"storage_key" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"columns" jsonb NOT NULL,
	"band" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"pass_fraction" double precision NOT NULL,
	"verdict" text NOT NULL,
	"review_accepted" boolean,
	"reviewed_by" integer,
	"reviewed_at" timestamp with time zone,
	"review_comment" text,
	"retracted_at" timestamp with time zone,
	"retracted_by" integer,
	"retraction_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "calibration_adoptions" ADD CONSTRAINT "calibration_adoptions_adopted_by_users_id_fk" FOREIGN KEY ("adopted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_studies" ADD CONSTRAINT "grid_studies_decision_id_decisions_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_studies" ADD CONSTRAINT "grid_studies_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_studies" ADD CONSTRAINT "grid_studies_retracted_by_users_id_fk" FOREIGN KEY ("retracted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_records" ADD CONSTRAINT "run_records_decision_id_decisions_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_records" ADD CONSTRAINT "run_records_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_records" ADD CONSTRAINT "run_records_retracted_by_users_id_fk" FOREIGN KEY ("retracted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_settings" ADD CONSTRAINT "team_settings_set_by_users_id_fk" FOREIGN KEY ("set_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wall_checks" ADD CONSTRAINT "wall_checks_decision_id_decisions_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wall_checks" ADD CONSTRAINT "wall_checks_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wall_checks" ADD CONSTRAINT "wall_checks_reviewed_by_users_id_fk" FOREIGN KEY ("reviewed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wall_checks" ADD CONSTRAINT "wall_checks_retracted_by_users_id_fk" FOREIGN KEY ("retracted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "grid_studies_decision_idx" ON "grid_studies" USING btree ("decision_id");--> statement-breakpoint
CREATE INDEX "run_records_decision_idx" ON "run_records" USING btree ("decision_id");--> statement-breakpoint
CREATE INDEX "run_records_approach_idx" ON "run_records" USING btree ("approach","hardware");--> statement-breakpoint
CREATE INDEX "wall_checks_decision_idx" ON "wall_checks" USING btree ("decision_id");