import type { JobDefinition } from "./define-job";
import { checkMembersJob } from "./jobs/check-members.job";
import { deliverWebhookJob } from "./jobs/deliver-webhook.job";
import { sendAccountMailJob } from "./jobs/send-account-mail.job";

/** Every job this worker process runs. Add a definition here to have workers/index.ts start it. */
export const jobDefinitions: JobDefinition[] = [
  checkMembersJob as unknown as JobDefinition,
  deliverWebhookJob as unknown as JobDefinition,
  sendAccountMailJob as unknown as JobDefinition,
];
