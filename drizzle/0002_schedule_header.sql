ALTER TABLE "schedules" ADD COLUMN "header" jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "schedule_members" DROP COLUMN "model";