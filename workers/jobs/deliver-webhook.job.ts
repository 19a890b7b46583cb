import { z } from "zod";

import { attemptDelivery } from "@/lib/server/webhooks/deliver";
import { enqueueDeliveries } from "@/lib/server/webhooks/enqueue";

import { defineJob } from "../define-job";
import { queueNames } from "../queues";

/** One delivery attempt; on failure it queues the next attempt itself, as a delayed job. */
export const deliverWebhookJob = defineJob({
  queue: queueNames.deliverWebhook,
  concurrency: { env: "WEBHOOK_DELIVERY_CONCURRENCY", default: 10 },
  payload: z.object({ deliveryId: z.string().min(1).max(64), attemptNumber: z.number().int().min(1) }),
  handle: async (payload) => {
    const outcome = await attemptDelivery(payload);
    if (outcome.kind === "retry") {
      await enqueueDeliveries([{ deliveryId: payload.deliveryId, ...outcome.next }]);
    }
    return outcome;
  },
});
