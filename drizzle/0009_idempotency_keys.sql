CREATE TABLE "idempotency_keys" (
	"person_id" uuid NOT NULL,
	"key" text NOT NULL,
	"method" text NOT NULL,
	"path" text NOT NULL,
	"status" integer,
	"body" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "idempotency_keys_person_id_key_pk" PRIMARY KEY("person_id","key")
);
