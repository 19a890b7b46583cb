import { z } from "zod";

import { sendPasswordResetMail } from "@/lib/server/auth/password-reset";

import { defineJob } from "../define-job";
import { queueNames } from "../queues";

/** Account e-mail sent off the request path, so the request answers the same for every address. */
export const sendAccountMailJob = defineJob({
  queue: queueNames.accountMail,
  concurrency: { env: "ACCOUNT_MAIL_CONCURRENCY", default: 2 },
  payload: z.object({ kind: z.literal("password-reset"), emailKey: z.string().min(1).max(320) }),
  handle: ({ emailKey }) => sendPasswordResetMail(emailKey),
});
