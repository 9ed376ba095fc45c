CREATE TABLE "rulebook_adoptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"version_id" uuid NOT NULL,
	"effective_from" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"adopted_by" text,
	"adopted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rulebook_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"number" integer NOT NULL,
	"based_on" uuid,
	"title" text NOT NULL,
	"document" jsonb NOT NULL,
	"origin" text DEFAULT 'edit' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"author_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rulebook_versions_number_positive" CHECK ("rulebook_versions"."number" > 0)
);
--> statement-breakpoint
CREATE TABLE "floor_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sitting_id" uuid NOT NULL,
	"chamber_id" text NOT NULL,
	"seq" integer NOT NULL,
	"kind" text NOT NULL,
	"payload" jsonb NOT NULL,
	"summary" text NOT NULL,
	"actor_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sittings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"title" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"rulebook_version_id" uuid,
	"state" jsonb NOT NULL,
	"revision" integer DEFAULT 0 NOT NULL,
	"opened_by" text,
	"opened_at" timestamp with time zone DEFAULT now() NOT NULL,
	"closed_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "rulebook_adoptions" ADD CONSTRAINT "rulebook_adoptions_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_adoptions" ADD CONSTRAINT "rulebook_adoptions_version_id_rulebook_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."rulebook_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_adoptions" ADD CONSTRAINT "rulebook_adoptions_adopted_by_user_id_fk" FOREIGN KEY ("adopted_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_versions" ADD CONSTRAINT "rulebook_versions_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_versions" ADD CONSTRAINT "rulebook_versions_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "floor_events" ADD CONSTRAINT "floor_events_sitting_id_sittings_id_fk" FOREIGN KEY ("sitting_id") REFERENCES "public"."sittings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "floor_events" ADD CONSTRAINT "floor_events_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "floor_events" ADD CONSTRAINT "floor_events_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sittings" ADD CONSTRAINT "sittings_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sittings" ADD CONSTRAINT "sittings_rulebook_version_id_rulebook_versions_id_fk" FOREIGN KEY ("rulebook_version_id") REFERENCES "public"."rulebook_versions"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sittings" ADD CONSTRAINT "sittings_opened_by_user_id_fk" FOREIGN KEY ("opened_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "rulebook_adoptions_chamber_idx" ON "rulebook_adoptions" USING btree ("chamber_id","effective_from");--> statement-breakpoint
CREATE UNIQUE INDEX "rulebook_versions_chamber_number_uq" ON "rulebook_versions" USING btree ("chamber_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "floor_events_sitting_seq_uq" ON "floor_events" USING btree ("sitting_id","seq");--> statement-breakpoint
CREATE INDEX "sittings_chamber_idx" ON "sittings" USING btree ("chamber_id","status");