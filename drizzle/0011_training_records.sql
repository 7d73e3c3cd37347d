CREATE TABLE "training_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"person_id" uuid NOT NULL,
	"master_record_version_id" uuid NOT NULL,
	"trained_on" date NOT NULL,
	"valid_until" date NOT NULL,
	"note" text,
	"recorded_by" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_by" uuid,
	"withdraw_reason" text,
	CONSTRAINT "training_records_dates_in_order" CHECK ("training_records"."valid_until" >= "training_records"."trained_on"),
	CONSTRAINT "training_records_withdrawal_whole" CHECK (("training_records"."withdrawn_at" is null) = ("training_records"."withdrawn_by" is null) and ("training_records"."withdrawn_at" is null) = ("training_records"."withdraw_reason" is null))
);
--> statement-breakpoint
ALTER TABLE "training_records" ADD CONSTRAINT "training_records_person_id_people_id_fk" FOREIGN KEY ("person_id") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "training_records" ADD CONSTRAINT "training_records_master_record_version_id_master_record_versions_id_fk" FOREIGN KEY ("master_record_version_id") REFERENCES "public"."master_record_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "training_records" ADD CONSTRAINT "training_records_recorded_by_people_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "training_records" ADD CONSTRAINT "training_records_withdrawn_by_people_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "training_records_person_version_idx" ON "training_records" USING btree ("person_id","master_record_version_id");