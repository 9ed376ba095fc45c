CREATE TABLE "circulations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"kind" text NOT NULL,
	"ruling_id" uuid,
	"ruling_revision" integer,
	"list_id" uuid,
	"list_name" text NOT NULL,
	"subject" text NOT NULL,
	"skipped" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sent_by" text,
	"sent_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "distribution_lists" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"purpose" text,
	"entries" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_suppressions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"list_id" uuid,
	"email" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ruling_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"ruling_id" uuid NOT NULL,
	"chamber_id" text NOT NULL,
	"revision" integer NOT NULL,
	"content" jsonb NOT NULL,
	"note" text NOT NULL,
	"issued_by" text,
	"issued_by_name" text NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rulings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"number" integer NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"revision" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"raised_by_id" uuid,
	"raised_by_name" text NOT NULL,
	"target_kind" text NOT NULL,
	"target_ref" text,
	"target_label" text NOT NULL,
	"measure_id" uuid,
	"measure_label" text,
	"amendment_id" uuid,
	"motion" text,
	"question" text NOT NULL,
	"decision" text,
	"decision_note" text,
	"reasoning" text DEFAULT '' NOT NULL,
	"citations" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"citation_keys" text[] DEFAULT '{}'::text[] NOT NULL,
	"citation_text" text DEFAULT '' NOT NULL,
	"appeal" jsonb,
	"sitting_id" uuid,
	"sitting" text DEFAULT '' NOT NULL,
	"sitting_date" date,
	"created_by" text,
	"issued_by" text,
	"issued_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english'::regconfig, coalesce(question, '') || ' ' || coalesce(citation_text, '')), 'A') || setweight(to_tsvector('english'::regconfig, coalesce(target_label, '') || ' ' || coalesce(measure_label, '') || ' ' || coalesce(motion, '') || ' ' || coalesce(decision_note, '')), 'B') || setweight(to_tsvector('english'::regconfig, coalesce(reasoning, '')), 'C') || setweight(to_tsvector('english'::regconfig, coalesce(raised_by_name, '') || ' ' || coalesce(sitting, '')), 'D')) STORED
);
--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "chamber_id" text;--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "circulation_id" uuid;--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "dedupe_key" text;--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "message_id" text;--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "claim_token" uuid;--> statement-breakpoint
ALTER TABLE "outbox" ADD COLUMN "lease_until" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "circulations" ADD CONSTRAINT "circulations_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circulations" ADD CONSTRAINT "circulations_ruling_id_rulings_id_fk" FOREIGN KEY ("ruling_id") REFERENCES "public"."rulings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circulations" ADD CONSTRAINT "circulations_list_id_distribution_lists_id_fk" FOREIGN KEY ("list_id") REFERENCES "public"."distribution_lists"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circulations" ADD CONSTRAINT "circulations_sent_by_user_id_fk" FOREIGN KEY ("sent_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "distribution_lists" ADD CONSTRAINT "distribution_lists_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_suppressions" ADD CONSTRAINT "mail_suppressions_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_suppressions" ADD CONSTRAINT "mail_suppressions_list_id_distribution_lists_id_fk" FOREIGN KEY ("list_id") REFERENCES "public"."distribution_lists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ruling_revisions" ADD CONSTRAINT "ruling_revisions_ruling_id_rulings_id_fk" FOREIGN KEY ("ruling_id") REFERENCES "public"."rulings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ruling_revisions" ADD CONSTRAINT "ruling_revisions_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ruling_revisions" ADD CONSTRAINT "ruling_revisions_issued_by_user_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_raised_by_id_legislators_id_fk" FOREIGN KEY ("raised_by_id") REFERENCES "public"."legislators"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_measure_id_measures_id_fk" FOREIGN KEY ("measure_id") REFERENCES "public"."measures"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_sitting_id_sittings_id_fk" FOREIGN KEY ("sitting_id") REFERENCES "public"."sittings"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulings" ADD CONSTRAINT "rulings_issued_by_user_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "circulations_chamber_idx" ON "circulations" USING btree ("chamber_id","created_at");--> statement-breakpoint
CREATE INDEX "circulations_ruling_idx" ON "circulations" USING btree ("ruling_id");--> statement-breakpoint
CREATE UNIQUE INDEX "distribution_lists_name_uq" ON "distribution_lists" USING btree ("chamber_id","name");--> statement-breakpoint
CREATE UNIQUE INDEX "mail_suppressions_uq" ON "mail_suppressions" USING btree ("chamber_id","email","list_id");--> statement-breakpoint
CREATE UNIQUE INDEX "ruling_revisions_uq" ON "ruling_revisions" USING btree ("ruling_id","revision");--> statement-breakpoint
CREATE UNIQUE INDEX "rulings_chamber_number_uq" ON "rulings" USING btree ("chamber_id","number");--> statement-breakpoint
CREATE INDEX "rulings_chamber_date_idx" ON "rulings" USING btree ("chamber_id","sitting_date");--> statement-breakpoint
CREATE INDEX "rulings_search_idx" ON "rulings" USING gin ("search");--> statement-breakpoint
CREATE INDEX "rulings_citation_keys_idx" ON "rulings" USING gin ("citation_keys");--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_circulation_id_circulations_id_fk" FOREIGN KEY ("circulation_id") REFERENCES "public"."circulations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "outbox_circulation_idx" ON "outbox" USING btree ("circulation_id");--> statement-breakpoint
CREATE UNIQUE INDEX "outbox_dedupe_uq" ON "outbox" USING btree ("dedupe_key");