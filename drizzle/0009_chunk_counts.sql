ALTER TABLE "schedule_chunks" ADD COLUMN "pass_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "schedule_chunks" ADD COLUMN "fail_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "schedule_chunks" ADD COLUMN "error_count" integer DEFAULT 0 NOT NULL;