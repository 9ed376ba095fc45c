CREATE TABLE "people_audit" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"chamber_id" text NOT NULL,
	"actor_id" text,
	"actor_name" text NOT NULL,
	"subject_id" text,
	"subject_name" text NOT NULL,
	"action" text NOT NULL,
	"from_role" text,
	"to_role" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "measures" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "measures" ADD COLUMN "archived_by" text;--> statement-breakpoint
ALTER TABLE "people_audit" ADD CONSTRAINT "people_audit_chamber_id_organization_id_fk" FOREIGN KEY ("chamber_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "people_audit" ADD CONSTRAINT "people_audit_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "people_audit" ADD CONSTRAINT "people_audit_subject_id_user_id_fk" FOREIGN KEY ("subject_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "people_audit_chamber_at_idx" ON "people_audit" USING btree ("chamber_id","at");--> statement-breakpoint
CREATE INDEX "people_audit_subject_idx" ON "people_audit" USING btree ("chamber_id","subject_id");--> statement-breakpoint
ALTER TABLE "measures" ADD CONSTRAINT "measures_archived_by_user_id_fk" FOREIGN KEY ("archived_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;