ALTER TABLE "member_checks" DROP CONSTRAINT "member_checks_schedule_id_schedules_id_fk";
--> statement-breakpoint
ALTER TABLE "member_outcomes" DROP CONSTRAINT "member_outcomes_schedule_id_schedules_id_fk";
--> statement-breakpoint
ALTER TABLE "member_outcomes" ALTER COLUMN "detail" SET DATA TYPE json;--> statement-breakpoint
ALTER TABLE "schedule_members" ALTER COLUMN "input" SET DATA TYPE json;