CREATE TABLE "chamber_texts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"number" integer NOT NULL,
	"title" text NOT NULL,
	"filename" text NOT NULL,
	"kind" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"text" text NOT NULL,
	"clauses" jsonb NOT NULL,
	"preamble" text DEFAULT '' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"author_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "chamber_texts_number_positive" CHECK ("chamber_texts"."number" > 0)
);
--> statement-breakpoint
CREATE TABLE "rulebook_scenarios" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"scenario_id" text NOT NULL,
	"position" integer NOT NULL,
	"document" jsonb NOT NULL,
	"author_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "chamber_texts" ADD CONSTRAINT "chamber_texts_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "chamber_texts" ADD CONSTRAINT "chamber_texts_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_scenarios" ADD CONSTRAINT "rulebook_scenarios_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rulebook_scenarios" ADD CONSTRAINT "rulebook_scenarios_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "chamber_texts_chamber_number_uq" ON "chamber_texts" USING btree ("chamber_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "rulebook_scenarios_chamber_scenario_uq" ON "rulebook_scenarios" USING btree ("chamber_id","scenario_id");