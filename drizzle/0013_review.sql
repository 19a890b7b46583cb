ALTER TABLE "member_reviews" ADD COLUMN "reference" text;--> statement-breakpoint
ALTER TABLE "member_reviews" ADD COLUMN "input_hash" text;--> statement-breakpoint
CREATE INDEX "member_reviews_carry_over_idx" ON "member_reviews" USING btree ("organization_id","reference","mark","input_hash") WHERE "member_reviews"."reference" is not null;