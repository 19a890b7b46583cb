ALTER TABLE "schedule_chunks" ADD COLUMN "marks" text[];--> statement-breakpoint
ALTER TABLE "schedule_chunks" ADD COLUMN "members" json;--> statement-breakpoint
-- lz4 rather than the default pglz: members are written in bulk and compress well either way.
ALTER TABLE "schedule_chunks" ALTER COLUMN "members" SET COMPRESSION lz4;--> statement-breakpoint
UPDATE "schedule_chunks" c SET "marks" = g.marks, "members" = g.members
FROM (
  SELECT c2.schedule_id, c2.chunk_index,
    array_agg(m.mark ORDER BY m.member_index) AS marks,
    json_agg(m.input ORDER BY m.member_index) AS members
  FROM "schedule_chunks" c2
  JOIN "schedule_members" m ON m.schedule_id = c2.schedule_id
    AND m.member_index >= c2.first_member AND m.member_index < c2.first_member + c2.member_count
  GROUP BY c2.schedule_id, c2.chunk_index
) g
WHERE g.schedule_id = c.schedule_id AND g.chunk_index = c.chunk_index;--> statement-breakpoint
UPDATE "schedule_chunks" SET "marks" = '{}', "members" = '[]' WHERE "marks" IS NULL;--> statement-breakpoint
ALTER TABLE "schedule_chunks" ALTER COLUMN "marks" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "schedule_chunks" ALTER COLUMN "members" SET NOT NULL;--> statement-breakpoint
DROP TABLE "schedule_members" CASCADE;
