ALTER TABLE "member_outcomes" ADD COLUMN "section" text;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "material" text;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "quantity" integer;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "spans_mm" double precision[];--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_error_idx" ON "member_outcomes" USING btree ("schedule_id","member_index") WHERE ("member_outcomes"."detail" ->> 'error') is not null;--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_utilization_idx" ON "member_outcomes" USING btree ("schedule_id",coalesce(-"utilization", 'Infinity'::float8),"member_index");--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_mark_idx" ON "member_outcomes" USING btree ("schedule_id",lower("mark") collate "C","member_index");