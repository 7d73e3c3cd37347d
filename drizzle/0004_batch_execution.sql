CREATE TABLE "batch_attachments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"step_key" text,
	"file_id" uuid NOT NULL,
	"note" text,
	"added_by" uuid NOT NULL,
	"added_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "batch_samples" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"sampled_at" timestamp with time zone NOT NULL,
	"volume_l" double precision NOT NULL,
	"lab_result" text,
	"file_id" uuid,
	"taken_by" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "batch_traces" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"file_id" uuid NOT NULL,
	"sha256" text NOT NULL,
	"points" integer NOT NULL,
	"t" double precision[] NOT NULL,
	"v" double precision[] NOT NULL,
	"temperature" double precision[],
	"pressure" double precision[],
	"added_by" uuid NOT NULL,
	"added_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "deviations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"step_key" text,
	"source" text DEFAULT 'person' NOT NULL,
	"title" text NOT NULL,
	"description" text NOT NULL,
	"severity" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"root_cause" text,
	"action" text,
	"covers_kinetics" boolean DEFAULT false NOT NULL,
	"raised_by" uuid,
	"raised_at" timestamp with time zone DEFAULT now() NOT NULL,
	"investigated_by" uuid,
	"investigated_at" timestamp with time zone,
	"closed_by" uuid,
	"closed_at" timestamp with time zone,
	"revision" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "step_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"phase" text NOT NULL,
	"step_key" text NOT NULL,
	"version" integer NOT NULL,
	"values" jsonb NOT NULL,
	"comments" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"out_of_limit" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"reason" text,
	"entered_by" uuid NOT NULL,
	"entered_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "step_entries_batch_step_version" UNIQUE("batch_id","step_key","version")
);
--> statement-breakpoint
ALTER TABLE "batches" ADD COLUMN "held_from" text;--> statement-breakpoint
ALTER TABLE "batches" ADD COLUMN "hold_reason" text;--> statement-breakpoint
ALTER TABLE "batch_attachments" ADD CONSTRAINT "batch_attachments_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_attachments" ADD CONSTRAINT "batch_attachments_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_attachments" ADD CONSTRAINT "batch_attachments_added_by_people_id_fk" FOREIGN KEY ("added_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_samples" ADD CONSTRAINT "batch_samples_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_samples" ADD CONSTRAINT "batch_samples_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_samples" ADD CONSTRAINT "batch_samples_taken_by_people_id_fk" FOREIGN KEY ("taken_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_traces" ADD CONSTRAINT "batch_traces_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_traces" ADD CONSTRAINT "batch_traces_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_traces" ADD CONSTRAINT "batch_traces_added_by_people_id_fk" FOREIGN KEY ("added_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_raised_by_people_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_investigated_by_people_id_fk" FOREIGN KEY ("investigated_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_closed_by_people_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_entries" ADD CONSTRAINT "step_entries_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_entries" ADD CONSTRAINT "step_entries_entered_by_people_id_fk" FOREIGN KEY ("entered_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "batch_attachments_batch_idx" ON "batch_attachments" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "batch_samples_batch_idx" ON "batch_samples" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "batch_traces_batch_idx" ON "batch_traces" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "deviations_batch_idx" ON "deviations" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "deviations_status_idx" ON "deviations" USING btree ("status");--> statement-breakpoint
CREATE INDEX "step_entries_batch_idx" ON "step_entries" USING btree ("batch_id");