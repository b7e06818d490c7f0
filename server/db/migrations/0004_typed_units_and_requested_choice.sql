CREATE TYPE "public"."unit_system" AS ENUM('si', 'imperial');--> statement-breakpoint
ALTER TABLE "decision_revisions" ADD COLUMN "unit_system" "unit_system" DEFAULT 'si' NOT NULL;--> statement-breakpoint
ALTER TABLE "decision_revisions" ADD COLUMN "entered" jsonb;--> statement-breakpoint
ALTER TABLE "decision_revisions" ADD COLUMN "requested" jsonb;--> statement-breakpoint
ALTER TABLE "decisions" ADD COLUMN "unit_system" "unit_system" DEFAULT 'si' NOT NULL;