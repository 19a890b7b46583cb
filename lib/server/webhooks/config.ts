import { z } from "zod";

// Webhook settings, read and validated once (lib/env.ts holds the process-wide ones).
const configSchema = z.object({
  /** Comma-separated hosts or host:port pairs the SSRF guard lets through (local development and tests only). */
  WEBHOOK_ALLOWLIST: z.string().default(""),
  /** Multiplies every retry delay; e.g. 0.001 in tests. Retry-After from the receiver is not scaled. */
  WEBHOOK_RETRY_SCALE: z.coerce.number().positive().max(1).default(1),
  WEBHOOK_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(10_000),
  /** How long the previous secret keeps signing after a rotation. */
  WEBHOOK_ROTATION_OVERLAP_HOURS: z.coerce.number().min(0).max(24 * 7).default(24),
  /** Dead deliveries in a row after which an endpoint is disabled. */
  WEBHOOK_DISABLE_AFTER_DEAD_DELIVERIES: z.coerce.number().int().min(1).max(1000).default(1),
});

export type WebhookConfig = {
  allowlist: string[];
  retryScale: number;
  timeoutMs: number;
  rotationOverlapMs: number;
  disableAfterDeadDeliveries: number;
};

let cached: WebhookConfig | undefined;

export function getWebhookConfig(): WebhookConfig {
  if (cached) return cached;
  const parsed = configSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid webhook configuration:\n${lines.join("\n")}`);
  }
  const env = parsed.data;
  cached = {
    allowlist: env.WEBHOOK_ALLOWLIST.split(",")
      .map((s) => s.trim().toLowerCase())
      .filter(Boolean),
    retryScale: env.WEBHOOK_RETRY_SCALE,
    timeoutMs: env.WEBHOOK_TIMEOUT_MS,
    rotationOverlapMs: env.WEBHOOK_ROTATION_OVERLAP_HOURS * 3_600_000,
    disableAfterDeadDeliveries: env.WEBHOOK_DISABLE_AFTER_DEAD_DELIVERIES,
  };
  return cached;
}
