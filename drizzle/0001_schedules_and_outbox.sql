CREATE TABLE "idempotency_keys" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "idempotency_keys_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"organization_id" text NOT NULL,
	"key" text NOT NULL,
	"request_hash" text NOT NULL,
	"state" text NOT NULL,
	"response_status" integer,
	"response_body" jsonb,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "member_checks" (
	"schedule_id" text NOT NULL,
	"member_index" integer NOT NULL,
	"check_key" text NOT NULL,
	"combination_id" text NOT NULL,
	"span_index" integer NOT NULL,
	"span_kind" text NOT NULL,
	"deflection_mm" double precision NOT NULL,
	"at_mm" double precision NOT NULL,
	"allowed_mm" double precision NOT NULL,
	"utilization" double precision NOT NULL,
	"factor_of_safety" double precision,
	"pass" boolean NOT NULL,
	CONSTRAINT "member_checks_schedule_id_member_index_check_key_pk" PRIMARY KEY("schedule_id","member_index","check_key")
);
--> statement-breakpoint
CREATE TABLE "member_outcomes" (
	"schedule_id" text NOT NULL,
	"member_index" integer NOT NULL,
	"mark" text NOT NULL,
	"category" text NOT NULL,
	"pass" boolean NOT NULL,
	"governing_check" text,
	"utilization" double precision,
	"factor_of_safety" double precision,
	"detail" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "member_outcomes_schedule_id_member_index_pk" PRIMARY KEY("schedule_id","member_index")
);
--> statement-breakpoint
CREATE TABLE "schedule_chunks" (
	"schedule_id" text NOT NULL,
	"chunk_index" integer NOT NULL,
	"first_member" integer NOT NULL,
	"member_count" integer NOT NULL,
	"done_at" timestamp with time zone,
	"attempts" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "schedule_chunks_schedule_id_chunk_index_pk" PRIMARY KEY("schedule_id","chunk_index")
);
--> statement-breakpoint
CREATE TABLE "schedule_members" (
	"schedule_id" text NOT NULL,
	"member_index" integer NOT NULL,
	"mark" text NOT NULL,
	"category" text NOT NULL,
	"input" jsonb NOT NULL,
	"model" jsonb NOT NULL,
	CONSTRAINT "schedule_members_schedule_id_member_index_pk" PRIMARY KEY("schedule_id","member_index")
);
--> statement-breakpoint
CREATE TABLE "schedules" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"project_id" text,
	"name" text NOT NULL,
	"reference" text,
	"status" text DEFAULT 'received' NOT NULL,
	"failure_reason" text,
	"source" text NOT NULL,
	"submitted_by_user_id" text,
	"api_key_id" text,
	"callback_endpoint_id" text,
	"profile" jsonb NOT NULL,
	"member_count" integer NOT NULL,
	"chunk_count" integer NOT NULL,
	"chunks_done" integer DEFAULT 0 NOT NULL,
	"checked_count" integer DEFAULT 0 NOT NULL,
	"pass_count" integer DEFAULT 0 NOT NULL,
	"fail_count" integer DEFAULT 0 NOT NULL,
	"error_count" integer DEFAULT 0 NOT NULL,
	"queued_at" timestamp with time zone,
	"completed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "outbox_events" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"type" text NOT NULL,
	"payload" jsonb NOT NULL,
	"dispatched_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "idempotency_keys" ADD CONSTRAINT "idempotency_keys_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_checks" ADD CONSTRAINT "member_checks_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD CONSTRAINT "member_outcomes_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_chunks" ADD CONSTRAINT "schedule_chunks_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_members" ADD CONSTRAINT "schedule_members_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_submitted_by_user_id_users_id_fk" FOREIGN KEY ("submitted_by_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbox_events" ADD CONSTRAINT "outbox_events_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "idempotency_keys_organization_id_key_idx" ON "idempotency_keys" USING btree ("organization_id","key");--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_pass_idx" ON "member_outcomes" USING btree ("schedule_id","pass","member_index");--> statement-breakpoint
CREATE UNIQUE INDEX "schedule_members_schedule_id_mark_idx" ON "schedule_members" USING btree ("schedule_id","mark");--> statement-breakpoint
CREATE INDEX "schedules_organization_id_created_at_idx" ON "schedules" USING btree ("organization_id","created_at","id");--> statement-breakpoint
CREATE INDEX "schedules_status_idx" ON "schedules" USING btree ("status") WHERE "schedules"."status" not in ('completed', 'failed');--> statement-breakpoint
CREATE INDEX "outbox_events_dispatched_at_created_at_idx" ON "outbox_events" USING btree ("dispatched_at","created_at");