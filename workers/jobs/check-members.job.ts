import { z } from "zod";

import { checkChunk } from "@/lib/server/schedules/check-chunk";

import { defineJob } from "../define-job";
import { queueNames } from "../queues";

export const checkMembersJob = defineJob({
  queue: queueNames.checkMembers,
  concurrency: { env: "CHECK_CONCURRENCY", default: 4 },
  payload: z.object({ scheduleId: z.string().regex(/^sch_[0-9a-z]+$/), chunkIndex: z.number().int().min(0) }),
  handle: ({ scheduleId, chunkIndex }) => checkChunk(scheduleId, chunkIndex),
});
