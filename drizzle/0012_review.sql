CREATE TABLE "member_dispositions" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "member_dispositions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"organization_id" text NOT NULL,
	"schedule_id" text NOT NULL,
	"member_index" integer NOT NULL,
	"mark" text NOT NULL,
	"kind" text NOT NULL,
	"justification" text,
	"decided_by_user_id" text,
	"decided_by_name" text NOT NULL,
	"decided_by_api_key_id" text,
	"bulk_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "member_reviews" (
	"schedule_id" text NOT NULL,
	"member_index" integer NOT NULL,
	"organization_id" text NOT NULL,
	"project_id" text,
	"mark" text NOT NULL,
	"category" text NOT NULL,
	"outcome" text NOT NULL,
	"governing_check" text,
	"utilization" double precision,
	"state" text DEFAULT 'awaiting_review' NOT NULL,
	"latest_disposition_id" bigint,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "member_reviews_schedule_id_member_index_pk" PRIMARY KEY("schedule_id","member_index")
);
--> statement-breakpoint
CREATE TABLE "review_digest_preferences" (
	"user_id" text NOT NULL,
	"organization_id" text NOT NULL,
	"frequency" text DEFAULT 'immediate' NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_digest_preferences_user_id_organization_id_pk" PRIMARY KEY("user_id","organization_id")
);
--> statement-breakpoint
ALTER TABLE "member_dispositions" ADD CONSTRAINT "member_dispositions_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_dispositions" ADD CONSTRAINT "member_dispositions_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_dispositions" ADD CONSTRAINT "member_dispositions_decided_by_user_id_users_id_fk" FOREIGN KEY ("decided_by_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_reviews" ADD CONSTRAINT "member_reviews_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_reviews" ADD CONSTRAINT "member_reviews_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_preferences" ADD CONSTRAINT "review_digest_preferences_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_preferences" ADD CONSTRAINT "review_digest_preferences_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "member_dispositions_schedule_member_idx" ON "member_dispositions" USING btree ("schedule_id","member_index","id");--> statement-breakpoint
CREATE INDEX "member_reviews_queue_utilization_idx" ON "member_reviews" USING btree ("organization_id","utilization" DESC NULLS LAST,"schedule_id","member_index") WHERE "member_reviews"."state" = 'awaiting_review';--> statement-breakpoint
CREATE INDEX "member_reviews_queue_age_idx" ON "member_reviews" USING btree ("organization_id","created_at","schedule_id","member_index") WHERE "member_reviews"."state" = 'awaiting_review';--> statement-breakpoint
CREATE INDEX "member_reviews_schedule_state_idx" ON "member_reviews" USING btree ("schedule_id","state","member_index");