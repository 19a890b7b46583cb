DROP INDEX "member_outcomes_schedule_id_pass_idx";--> statement-breakpoint
ALTER TABLE "member_outcomes" ALTER COLUMN "detail" DROP NOT NULL;--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_failing_idx" ON "member_outcomes" USING btree ("schedule_id","member_index") WHERE not "member_outcomes"."pass";