ALTER TABLE "schedule_chunks" ALTER COLUMN "members" SET DATA TYPE text USING "members"::text;--> statement-breakpoint
-- the type change rewrote the column: lz4 again (see 0006)
ALTER TABLE "schedule_chunks" ALTER COLUMN "members" SET COMPRESSION lz4;
