ALTER TABLE "member_checks" ADD COLUMN "limit_ratio" double precision;--> statement-breakpoint
ALTER TABLE "member_checks" ADD COLUMN "achieved_ratio" double precision;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "limit_ratio" double precision;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "achieved_ratio" double precision;