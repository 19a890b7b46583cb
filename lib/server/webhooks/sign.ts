import { randomBytes } from "node:crypto";

import { Webhook } from "svix";

/** A Standard Webhooks signing secret: `whsec_` + base64 of 32 random bytes (the scheme allows 24 to 64). */
export function createSigningSecret(): string {
  return `whsec_${randomBytes(32).toString("base64")}`;
}

export interface SignedHeaders {
  "webhook-id": string;
  "webhook-timestamp": string;
  "webhook-signature": string;
}

/**
 * Standard Webhooks v1 headers for one attempt: HMAC-SHA256 over `id.timestamp.body` with each
 * secret (svix's Webhook class), space-separated, so a receiver holding either secret of a
 * rotation verifies. The timestamp is the attempt's own, in Unix seconds.
 */
export function signDelivery(input: { messageId: string; at: Date; body: string; secrets: readonly string[] }): SignedHeaders {
  if (input.secrets.length === 0) throw new Error("no signing secret");
  const signatures = input.secrets.map((secret) => new Webhook(secret).sign(input.messageId, input.at, input.body));
  return {
    "webhook-id": input.messageId,
    "webhook-timestamp": String(Math.floor(input.at.getTime() / 1000)),
    "webhook-signature": signatures.join(" "),
  };
}

/** The secrets that sign at a moment: the previous one (during its overlap window) first, then the current one. */
export function listSigningSecrets(endpoint: { secret: string; previousSecret: string | null; previousSecretExpiresAt: Date | null }, now: Date): string[] {
  const overlap = endpoint.previousSecret && endpoint.previousSecretExpiresAt && endpoint.previousSecretExpiresAt.getTime() > now.getTime();
  return overlap ? [endpoint.previousSecret!, endpoint.secret] : [endpoint.secret];
}
