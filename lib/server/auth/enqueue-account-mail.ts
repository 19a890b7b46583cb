import { createId } from "@/lib/server/ids";
import { defaultJobOptions, getQueue, queueNames } from "@/workers/queues";

/** Queues the reset mail for an address (normalised); the payload holds the address, never a token. */
export async function enqueuePasswordResetMail(emailKey: string): Promise<void> {
  await getQueue(queueNames.accountMail).add(
    "send-password-reset",
    { kind: "password-reset", emailKey },
    // Each request is its own job: two requests a minute apart are two mails (both throttled).
    { ...defaultJobOptions, jobId: createId("mailjob") },
  );
}
