import { z } from "zod";

import { dispatchOutboxUntilEmpty } from "@/lib/server/webhooks/dispatch-outbox";

import { defineJob } from "../define-job";
import { queueNames } from "../queues";

/** Fans the outbox out at once; producers may queue it right after writing an event (the periodic task also runs it). */
export const dispatchOutboxJob = defineJob({
  queue: queueNames.dispatchOutbox,
  concurrency: { env: "OUTBOX_DISPATCH_CONCURRENCY", default: 1 },
  payload: z.object({}).passthrough(),
  handle: async () => ({ dispatched: await dispatchOutboxUntilEmpty() }),
});
