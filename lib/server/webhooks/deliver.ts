import { and, eq, inArray, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { outboxEvents, webhookAttempts, webhookDeliveries, webhookEndpoints, type EndpointDisabledReason } from "@/db/schema";

import { getWebhookConfig, type WebhookConfig } from "./config";
import { buildEventBody, EventBodyError } from "./events/build-body";
import { PostError, postToTarget, type PostResult } from "./http-post";
import { notifyEndpointDisabled } from "./notify-disabled";
import { classifyStatus, computeRetryDelayMs, parseRetryAfterMs } from "./retry-schedule";
import { listSigningSecrets, signDelivery } from "./sign";
import { UnsafeUrlError, vetWebhookUrl, type Resolver } from "./ssrf-guard";

export interface AttemptDeps {
  config?: Partial<WebhookConfig>;
  resolve?: Resolver;
  now?: () => Date;
  random?: () => number;
}

export type AttemptOutcome =
  | { kind: "skipped"; reason: string }
  | { kind: "succeeded"; statusCode: number }
  | { kind: "retry"; statusCode: number | null; error: string | null; next: { attemptNumber: number; delayMs: number } }
  | { kind: "dead"; statusCode: number | null; error: string | null; disabled: EndpointDisabledReason | null };

const ERROR_TEXT_LIMIT = 500;

async function loadDelivery(deliveryId: string) {
  const [row] = await getDb()
    .select({ delivery: webhookDeliveries, endpoint: webhookEndpoints, event: outboxEvents })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .innerJoin(outboxEvents, eq(outboxEvents.id, webhookDeliveries.eventId))
    .where(eq(webhookDeliveries.id, deliveryId));
  return row ?? null;
}

async function send(url: string, headers: Record<string, string>, body: string, config: WebhookConfig, resolve: Resolver | undefined) {
  const started = performance.now();
  let result: PostResult | null = null;
  let error: string | null = null;
  try {
    const target = await vetWebhookUrl(url, { allowlist: config.allowlist, resolve });
    result = await postToTarget(target, { headers, body, timeoutMs: config.timeoutMs });
  } catch (e) {
    if (e instanceof UnsafeUrlError) error = `refused by the SSRF guard: the URL ${e.message}`;
    else if (e instanceof PostError) error = e.message;
    else throw e;
  }
  return { result, error: error?.slice(0, ERROR_TEXT_LIMIT) ?? null, latencyMs: Math.max(0, Math.round(performance.now() - started)) };
}

/**
 * Makes attempt `attemptNumber` of a delivery: signs the event with the endpoint's secret(s)
 * (webhook-id = the event id, the same on every retry; a fresh webhook-timestamp), POSTs it
 * through the SSRF guard, records the attempt and moves the delivery on: succeeded; retry with the
 * next delay (Retry-After honoured on 429 and 5xx); dead when the schedule is exhausted or the
 * receiver answered 410 (which disables the endpoint). A stale or repeated job is skipped, so
 * running it twice records one attempt.
 */
export async function attemptDelivery(input: { deliveryId: string; attemptNumber: number }, deps: AttemptDeps = {}): Promise<AttemptOutcome> {
  const config = { ...getWebhookConfig(), ...deps.config };
  const now = deps.now?.() ?? new Date();
  const row = await loadDelivery(input.deliveryId);
  if (!row) return { kind: "skipped", reason: "delivery not found" };
  const { delivery, endpoint, event } = row;
  if (delivery.status === "succeeded" || delivery.status === "dead") return { kind: "skipped", reason: `delivery is ${delivery.status}` };
  if (delivery.attemptCount !== input.attemptNumber - 1) return { kind: "skipped", reason: "stale attempt" };

  if (!endpoint.enabled) {
    await getDb()
      .update(webhookDeliveries)
      .set({ status: "dead", nextAttemptAt: null, lastError: "The endpoint is disabled.", updatedAt: now })
      .where(and(eq(webhookDeliveries.id, delivery.id), eq(webhookDeliveries.attemptCount, delivery.attemptCount)));
    return { kind: "dead", statusCode: null, error: "endpoint disabled", disabled: null };
  }

  let sent: Awaited<ReturnType<typeof send>>;
  try {
    const body = await buildEventBody(event);
    const headers = signDelivery({ messageId: event.id, at: now, body, secrets: listSigningSecrets(endpoint, now) });
    sent = await send(endpoint.url, { ...headers }, body, config, deps.resolve);
  } catch (e) {
    // An event whose body cannot be built (its schedule is gone, a malformed payload) follows the
    // retry schedule to "dead" like any failure, instead of failing the job forever.
    if (!(e instanceof EventBodyError)) throw e;
    sent = { result: null, error: e.message.slice(0, ERROR_TEXT_LIMIT), latencyMs: 0 };
  }
  const { result, error, latencyMs } = sent;

  const statusCode = result?.statusCode ?? null;
  const verdict = result ? classifyStatus(result.statusCode) : "retry";
  let outcome: AttemptOutcome;
  if (verdict === "success") {
    outcome = { kind: "succeeded", statusCode: statusCode! };
  } else if (verdict === "gone") {
    outcome = { kind: "dead", statusCode, error, disabled: "gone" };
  } else {
    const honoursRetryAfter = statusCode === 429 || (statusCode !== null && statusCode >= 500);
    const retryAfterMs = honoursRetryAfter ? parseRetryAfterMs(headerValue(result?.headers["retry-after"]), now) : undefined;
    const delayMs = computeRetryDelayMs({ attemptsMade: delivery.roundAttempts + 1, scale: config.retryScale, random: (deps.random ?? Math.random)(), retryAfterMs });
    outcome =
      delayMs === null
        ? { kind: "dead", statusCode, error, disabled: null }
        : { kind: "retry", statusCode, error, next: { attemptNumber: input.attemptNumber + 1, delayMs } };
  }

  const recorded = await getDb().transaction(async (tx) => {
    const inserted = await tx
      .insert(webhookAttempts)
      .values({
        deliveryId: delivery.id,
        attemptNumber: input.attemptNumber,
        statusCode,
        latencyMs,
        responseBody: result?.body ?? null,
        error,
        outcome: outcome.kind === "dead" && outcome.disabled === "gone" ? "gone" : outcome.kind,
        createdAt: now,
        updatedAt: now,
      })
      .onConflictDoNothing()
      .returning({ id: webhookAttempts.id });
    if (inserted.length === 0) return { recorded: false, disabled: null };
    const moved = await tx
      .update(webhookDeliveries)
      .set({
        status: outcome.kind === "succeeded" ? "succeeded" : outcome.kind === "retry" ? "failed" : "dead",
        attemptCount: input.attemptNumber,
        roundAttempts: delivery.roundAttempts + 1,
        nextAttemptAt: outcome.kind === "retry" ? new Date(now.getTime() + outcome.next.delayMs) : null,
        lastStatusCode: statusCode,
        lastError: error,
        succeededAt: outcome.kind === "succeeded" ? now : null,
        updatedAt: now,
      })
      .where(and(eq(webhookDeliveries.id, delivery.id), eq(webhookDeliveries.attemptCount, input.attemptNumber - 1), inArray(webhookDeliveries.status, ["pending", "failed"])))
      .returning({ id: webhookDeliveries.id });
    if (moved.length === 0) tx.rollback();

    let disabled: EndpointDisabledReason | null = null;
    if (outcome.kind === "succeeded") {
      await tx.update(webhookEndpoints).set({ consecutiveFailedDeliveries: 0, updatedAt: now }).where(eq(webhookEndpoints.id, endpoint.id));
    } else if (outcome.kind === "dead") {
      const [counted] = await tx
        .update(webhookEndpoints)
        .set({ consecutiveFailedDeliveries: sql`${webhookEndpoints.consecutiveFailedDeliveries} + 1`, updatedAt: now })
        .where(eq(webhookEndpoints.id, endpoint.id))
        .returning({ failures: webhookEndpoints.consecutiveFailedDeliveries });
      const reason: EndpointDisabledReason | null =
        outcome.disabled === "gone" ? "gone" : (counted?.failures ?? 0) >= config.disableAfterDeadDeliveries ? "failing" : null;
      if (reason) {
        const turnedOff = await tx
          .update(webhookEndpoints)
          .set({ enabled: false, disabledReason: reason, disabledAt: now, updatedAt: now })
          .where(and(eq(webhookEndpoints.id, endpoint.id), eq(webhookEndpoints.enabled, true)))
          .returning({ id: webhookEndpoints.id });
        if (turnedOff.length > 0) disabled = reason;
      }
    }
    return { recorded: true, disabled };
  }).catch((e: unknown) => {
    // tx.rollback() throws to abort: another run of this attempt got there first.
    if ((e as Error)?.name === "TransactionRollbackError") return { recorded: false, disabled: null };
    throw e;
  });
  if (!recorded.recorded) return { kind: "skipped", reason: "attempt already recorded" };

  if (recorded.disabled) {
    try {
      await notifyEndpointDisabled({ endpointId: endpoint.id, organizationId: endpoint.organizationId, url: endpoint.url, reason: recorded.disabled, lastError: error, lastStatusCode: statusCode });
    } catch (e) {
      console.error(`[webhooks] could not e-mail about disabled endpoint ${endpoint.id}: ${(e as Error).message}`);
    }
  }
  if (outcome.kind === "dead") return { ...outcome, disabled: recorded.disabled };
  return outcome;
}

function headerValue(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}
