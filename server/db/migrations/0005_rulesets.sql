CREATE TYPE "public"."ruleset_event_type" AS ENUM('installed', 'published');--> statement-breakpoint
CREATE TYPE "public"."ruleset_status" AS ENUM('draft', 'published', 'retired');--> statement-breakpoint
CREATE TABLE "ruleset_cases" (
	"id" serial PRIMARY KEY NOT NULL,
	"ruleset_id" integer NOT NULL,
	"position" integer NOT NULL,
	"title" text NOT NULL,
	"case_input" jsonb NOT NULL,
	"expected" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ruleset_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"seq" integer NOT NULL,
	"ruleset_id" integer NOT NULL,
	"type" "ruleset_event_type" NOT NULL,
	"actor_id" integer,
	"actor_role" "role",
	"payload" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"prev_hash" text NOT NULL,
	"hash" text NOT NULL,
	CONSTRAINT "ruleset_events_seq_unique" UNIQUE("seq")
);
--> statement-breakpoint
CREATE TABLE "rulesets" (
	"id" serial PRIMARY KEY NOT NULL,
	"key" text NOT NULL,
	"version" text NOT NULL,
	"status" "ruleset_status" DEFAULT 'draft' NOT NULL,
	"base_scores" jsonb NOT NULL,
	"base_why" text NOT NULL,
	"rules" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"based_on_id" integer,
	"content_hash" text,
	"created_by" integer,
	"published_by" integer,
	"published_at" timestamp with time zone,
	"retired_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "ruleset_cases" ADD CONSTRAINT "ruleset_cases_ruleset_id_rulesets_id_fk" FOREIGN KEY ("ruleset_id") REFERENCES "public"."rulesets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ruleset_events" ADD CONSTRAINT "ruleset_events_ruleset_id_rulesets_id_fk" FOREIGN KEY ("ruleset_id") REFERENCES "public"."rulesets"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ruleset_events" ADD CONSTRAINT "ruleset_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulesets" ADD CONSTRAINT "rulesets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulesets" ADD CONSTRAINT "rulesets_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "ruleset_cases_position_unique" ON "ruleset_cases" USING btree ("ruleset_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "rulesets_released_version_unique" ON "rulesets" USING btree ("key","version") WHERE "rulesets"."status" <> 'draft';--> statement-breakpoint
CREATE UNIQUE INDEX "rulesets_one_published" ON "rulesets" USING btree ("status") WHERE "rulesets"."status" = 'published';