CREATE TABLE "amendments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"measure_id" uuid NOT NULL,
	"number" integer,
	"title" text,
	"form" text NOT NULL,
	"target_kind" text NOT NULL,
	"target_section" text,
	"target_amendment_id" uuid,
	"line_from" integer,
	"line_to" integer,
	"text" text DEFAULT '' NOT NULL,
	"subjects" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sponsors" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"committee" text,
	"status" text DEFAULT 'filed' NOT NULL,
	"filed_at" timestamp with time zone,
	"filed_by" text,
	"attachment_id" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measure_attachments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"filename" text NOT NULL,
	"media_type" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"bytes" "bytea" NOT NULL,
	"extracted_text" text,
	"uploaded_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measure_audit" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"measure_id" uuid NOT NULL,
	"entity" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"action" text NOT NULL,
	"version" integer NOT NULL,
	"actor_id" text,
	"actor_name" text NOT NULL,
	"before" jsonb,
	"after" jsonb,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"number" text NOT NULL,
	"title" text NOT NULL,
	"committee" text,
	"status" text DEFAULT 'introduced' NOT NULL,
	"subjects" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sections" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sponsors" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sitting_at" timestamp with time zone,
	"attachment_id" uuid,
	"amendment_counter" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tree_overrides" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"measure_id" uuid NOT NULL,
	"amendment_id" uuid NOT NULL,
	"code" text NOT NULL,
	"ruling_ref" text NOT NULL,
	"ruling_id" uuid,
	"note" text,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_measure_id_measures_id_fk" FOREIGN KEY ("measure_id") REFERENCES "public"."measures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_filed_by_user_id_fk" FOREIGN KEY ("filed_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_attachment_id_measure_attachments_id_fk" FOREIGN KEY ("attachment_id") REFERENCES "public"."measure_attachments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure_attachments" ADD CONSTRAINT "measure_attachments_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure_attachments" ADD CONSTRAINT "measure_attachments_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure_audit" ADD CONSTRAINT "measure_audit_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure_audit" ADD CONSTRAINT "measure_audit_measure_id_measures_id_fk" FOREIGN KEY ("measure_id") REFERENCES "public"."measures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure_audit" ADD CONSTRAINT "measure_audit_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measures" ADD CONSTRAINT "measures_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measures" ADD CONSTRAINT "measures_attachment_id_measure_attachments_id_fk" FOREIGN KEY ("attachment_id") REFERENCES "public"."measure_attachments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measures" ADD CONSTRAINT "measures_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_overrides" ADD CONSTRAINT "tree_overrides_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_overrides" ADD CONSTRAINT "tree_overrides_measure_id_measures_id_fk" FOREIGN KEY ("measure_id") REFERENCES "public"."measures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_overrides" ADD CONSTRAINT "tree_overrides_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_overrides" ADD CONSTRAINT "tree_overrides_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "amendments_measure_number_uq" ON "amendments" USING btree ("measure_id","number");--> statement-breakpoint
CREATE INDEX "amendments_chamber_measure_idx" ON "amendments" USING btree ("chamber_id","measure_id");--> statement-breakpoint
CREATE INDEX "measure_attachments_chamber_idx" ON "measure_attachments" USING btree ("chamber_id");--> statement-breakpoint
CREATE INDEX "measure_audit_measure_idx" ON "measure_audit" USING btree ("measure_id","at");--> statement-breakpoint
CREATE INDEX "measure_audit_entity_idx" ON "measure_audit" USING btree ("entity_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "measures_chamber_number_uq" ON "measures" USING btree ("chamber_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "tree_overrides_finding_uq" ON "tree_overrides" USING btree ("amendment_id","code");--> statement-breakpoint
CREATE INDEX "tree_overrides_measure_idx" ON "tree_overrides" USING btree ("measure_id");