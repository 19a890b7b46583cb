CREATE TABLE "review_digest_sends" (
	"user_id" text NOT NULL,
	"organization_id" text NOT NULL,
	"schedule_id" text NOT NULL,
	"frequency" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_digest_sends_user_id_schedule_id_pk" PRIMARY KEY("user_id","schedule_id")
);
--> statement-breakpoint
CREATE TABLE "catalogue_sections" (
	"catalogue_id" text NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"name_key" text NOT NULL,
	"i_mm4" double precision NOT NULL,
	"area_mm2" double precision NOT NULL,
	"mass_kg_per_m" double precision NOT NULL,
	"shear_area_mm2" double precision,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "catalogue_sections_catalogue_id_position_pk" PRIMARY KEY("catalogue_id","position")
);
--> statement-breakpoint
CREATE TABLE "limit_profile_versions" (
	"profile_id" text NOT NULL,
	"version" integer NOT NULL,
	"label" text NOT NULL,
	"source" text NOT NULL,
	"definition" jsonb NOT NULL,
	"resolved" jsonb NOT NULL,
	"created_by_user_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "limit_profile_versions_profile_id_version_pk" PRIMARY KEY("profile_id","version")
);
--> statement-breakpoint
CREATE TABLE "limit_profiles" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"label" text NOT NULL,
	"source" text NOT NULL,
	"based_on_preset" text,
	"current_version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "organization_materials" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"family" text NOT NULL,
	"e_mpa" double precision NOT NULL,
	"g_mpa" double precision,
	"density_kg_per_m3" double precision,
	"creep_factor" double precision,
	"source" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "schedule_criteria" (
	"schedule_id" text PRIMARY KEY NOT NULL,
	"profile_id" text,
	"profile_version" integer,
	"recheck_of_schedule_id" text,
	"catalogue_ids" text[] NOT NULL,
	"catalogue" jsonb NOT NULL,
	"materials" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "section_catalogues" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"source" text NOT NULL,
	"in_use" boolean DEFAULT true NOT NULL,
	"section_count" integer DEFAULT 0 NOT NULL,
	"created_by_user_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "section" text;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "material" text;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "quantity" integer;--> statement-breakpoint
ALTER TABLE "member_outcomes" ADD COLUMN "spans_mm" double precision[];--> statement-breakpoint
ALTER TABLE "member_reviews" ADD COLUMN "reference" text;--> statement-breakpoint
ALTER TABLE "member_reviews" ADD COLUMN "input_hash" text;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_digest_sends" ADD CONSTRAINT "review_digest_sends_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_sections" ADD CONSTRAINT "catalogue_sections_catalogue_id_section_catalogues_id_fk" FOREIGN KEY ("catalogue_id") REFERENCES "public"."section_catalogues"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "limit_profile_versions" ADD CONSTRAINT "limit_profile_versions_profile_id_limit_profiles_id_fk" FOREIGN KEY ("profile_id") REFERENCES "public"."limit_profiles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "limit_profile_versions" ADD CONSTRAINT "limit_profile_versions_created_by_user_id_users_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "limit_profiles" ADD CONSTRAINT "limit_profiles_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "organization_materials" ADD CONSTRAINT "organization_materials_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_criteria" ADD CONSTRAINT "schedule_criteria_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "section_catalogues" ADD CONSTRAINT "section_catalogues_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "section_catalogues" ADD CONSTRAINT "section_catalogues_created_by_user_id_users_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "review_digest_sends_user_id_sent_at_idx" ON "review_digest_sends" USING btree ("user_id","sent_at");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_sections_catalogue_id_name_key_idx" ON "catalogue_sections" USING btree ("catalogue_id","name_key");--> statement-breakpoint
CREATE INDEX "limit_profiles_organization_id_idx" ON "limit_profiles" USING btree ("organization_id");--> statement-breakpoint
CREATE UNIQUE INDEX "organization_materials_organization_id_name_idx" ON "organization_materials" USING btree ("organization_id",lower("name"));--> statement-breakpoint
CREATE UNIQUE INDEX "section_catalogues_organization_id_name_idx" ON "section_catalogues" USING btree ("organization_id",lower("name"));--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_error_idx" ON "member_outcomes" USING btree ("schedule_id","member_index") WHERE ("member_outcomes"."detail" ->> 'error') is not null;--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_utilization_idx" ON "member_outcomes" USING btree ("schedule_id",coalesce(-"utilization", 'Infinity'::float8),"member_index");--> statement-breakpoint
CREATE INDEX "member_outcomes_schedule_id_mark_idx" ON "member_outcomes" USING btree ("schedule_id",lower("mark") collate "C","member_index");--> statement-breakpoint
CREATE INDEX "member_reviews_carry_over_idx" ON "member_reviews" USING btree ("organization_id","reference","mark","input_hash") WHERE "member_reviews"."reference" is not null;