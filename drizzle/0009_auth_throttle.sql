CREATE TABLE "auth_throttle" (
	"kind" text NOT NULL,
	"subject" text NOT NULL,
	"count" integer NOT NULL,
	"window_started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_at" timestamp with time zone DEFAULT now() NOT NULL,
	"locked_until" timestamp with time zone,
	CONSTRAINT "auth_throttle_kind_subject_pk" PRIMARY KEY("kind","subject")
);
