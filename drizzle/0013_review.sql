CREATE TABLE "review_digest_sends" (
	"user_id" text NOT NULL,
	"organization_id" text NOT NULL,
	"schedule_id" text NOT NULL,
	"frequency" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_digest_sends_user_id_schedule_id_pk" PRIMARY KEY("user_id","schedule_id")
);
--> statement-breakpoint
ALTER TABLE "member_reviews" ADD COLUMN "reference" text;--> statement-breakpoint
ALTER TABLE "member_reviews" ADD COLUMN "input_hash" text;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "review_digest_sends_user_id_sent_at_idx" ON "review_digest_sends" USING btree ("user_id","sent_at");--> statement-breakpoint
CREATE INDEX "member_reviews_carry_over_idx" ON "member_reviews" USING btree ("organization_id","reference","mark","input_hash") WHERE "member_reviews"."reference" is not null;