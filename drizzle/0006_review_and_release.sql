CREATE TABLE "batch_record_documents" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"file_id" uuid NOT NULL,
	"sha256" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "kinetics_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"rate_model_version_id" uuid NOT NULL,
	"library_version" text NOT NULL,
	"trace_hashes" jsonb NOT NULL,
	"inputs" jsonb NOT NULL,
	"verdict" text NOT NULL,
	"reasons" jsonb NOT NULL,
	"k_observed" double precision,
	"k_observed_low" double precision,
	"k_observed_high" double precision,
	"k_model" double precision NOT NULL,
	"deviation_pct" double precision,
	"residual_rms" double precision,
	"points" integer NOT NULL,
	"max_conversion" double precision,
	"result" jsonb NOT NULL,
	"ran_by" uuid,
	"ran_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "batch_record_documents" ADD CONSTRAINT "batch_record_documents_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_record_documents" ADD CONSTRAINT "batch_record_documents_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_checks" ADD CONSTRAINT "kinetics_checks_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_checks" ADD CONSTRAINT "kinetics_checks_ran_by_people_id_fk" FOREIGN KEY ("ran_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "kinetics_checks_batch_idx" ON "kinetics_checks" USING btree ("batch_id");