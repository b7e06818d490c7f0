CREATE TABLE "ledger_checkpoints" (
	"number" integer PRIMARY KEY NOT NULL,
	"seq" bigint NOT NULL,
	"hash" text NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	"key_id" text NOT NULL,
	"signature" text NOT NULL,
	"reason" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ledger_entries" (
	"seq" bigint PRIMARY KEY NOT NULL,
	"subject_type" text NOT NULL,
	"subject_id" text NOT NULL,
	"type" text NOT NULL,
	"record_table" text,
	"record_id" bigint,
	"record_hash" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"prev_hash" text NOT NULL,
	"hash" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ledger_keys" (
	"id" serial PRIMARY KEY NOT NULL,
	"key_id" text NOT NULL,
	"algorithm" text DEFAULT 'ed25519' NOT NULL,
	"public_key" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	CONSTRAINT "ledger_keys_key_id_unique" UNIQUE("key_id")
);
--> statement-breakpoint
CREATE TABLE "ledger_verifications" (
	"id" serial PRIMARY KEY NOT NULL,
	"mode" text NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"finished_at" timestamp with time zone NOT NULL,
	"snapshot_xmin" text NOT NULL,
	"head_seq" bigint NOT NULL,
	"head_hash" text NOT NULL,
	"entries" integer NOT NULL,
	"checkpoints" integer NOT NULL,
	"problems" jsonb NOT NULL,
	"key_id" text,
	"signature" text
);
--> statement-breakpoint
CREATE INDEX "ledger_entries_subject_idx" ON "ledger_entries" USING btree ("subject_type","subject_id","seq");--> statement-breakpoint
CREATE UNIQUE INDEX "ledger_entries_record_unique" ON "ledger_entries" USING btree ("record_table","record_id");