"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { idSchema } from "@/lib/server/validation";
import {
  createEndpoint as create,
  deleteEndpoint as remove,
  revealEndpointSecret,
  rotateEndpointSecret,
  sendTestEvent as sendTest,
  setEndpointEnabled as setEnabled,
  updateEndpoint as update,
  DESCRIPTION_MAX_LENGTH,
  URL_MAX_LENGTH,
} from "@/lib/server/webhooks/endpoints";
import { subscribableEventTypes } from "@/lib/server/webhooks/events/event-types";
import { resendDelivery as resendOne, resendFailedSince as resendSince } from "@/lib/server/webhooks/resend";

import { formatDateTime } from "../../_components/format-date-time";

const urlSchema = z.string({ error: "Enter the receiver's URL." }).trim().min(1, "Enter the receiver's URL.").max(URL_MAX_LENGTH, `Use at most ${URL_MAX_LENGTH} characters.`);
const descriptionSchema = z.string().trim().max(DESCRIPTION_MAX_LENGTH, `Keep the description under ${DESCRIPTION_MAX_LENGTH} characters.`).optional();

// Each event is its own checkbox (`event:schedule.completed`), because form data keeps one value per name.
const endpointFormSchema = z.looseObject({ url: urlSchema, description: descriptionSchema });
function eventTypesOf(input: Record<string, unknown>): string[] {
  return subscribableEventTypes.filter((t) => input[`event:${t}`] === "on" || input[`event:${t}`] === true);
}

const endpointIdSchema = z.object({ endpointId: idSchema("wh") });

export async function createEndpoint(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/createEndpoint", endpointFormSchema, formData, async (input, context) => {
    await create({ organizationId: getActionOrganizationId(context), url: input.url, description: input.description, eventTypes: eventTypesOf(input) });
    revalidatePath("/integrations/webhooks");
    return { ok: true, message: "Endpoint added. Reveal its signing secret to set up your receiver." };
  });
}

const updateSchema = endpointFormSchema.extend({ endpointId: idSchema("wh") });

export async function updateEndpoint(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/updateEndpoint", updateSchema, formData, async (input, context) => {
    await update({ organizationId: getActionOrganizationId(context), endpointId: input.endpointId, url: input.url, description: input.description ?? "", eventTypes: eventTypesOf(input) });
    revalidatePath("/integrations/webhooks");
    return { ok: true, message: "Endpoint saved." };
  });
}

const enabledSchema = z.object({ endpointId: idSchema("wh"), enabled: z.enum(["true", "false"], { error: "Choose enable or disable." }) });

export async function setEndpointEnabled(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/setEndpointEnabled", enabledSchema, formData, async ({ endpointId, enabled }, context) => {
    await setEnabled({ organizationId: getActionOrganizationId(context), endpointId, enabled: enabled === "true" });
    revalidatePath("/integrations/webhooks");
    return { ok: true, message: enabled === "true" ? "Endpoint enabled. Resend what failed from the delivery log." : "Endpoint disabled. Nothing is sent to it until it is enabled." };
  });
}

export async function deleteEndpoint(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/deleteEndpoint", endpointIdSchema, formData, async ({ endpointId }, context) => {
    await remove({ organizationId: getActionOrganizationId(context), endpointId });
    revalidatePath("/integrations/webhooks");
    return { ok: true, message: "Endpoint deleted, with its delivery log." };
  });
}

export async function revealSecret(_prev: ActionResult<{ secret: string; previousSecret: string | null }> | null, formData: FormData): Promise<ActionResult<{ secret: string; previousSecret: string | null }>> {
  return runAction("webhooks/revealSecret", endpointIdSchema, formData, async ({ endpointId }, context) => {
    const { secret, previousSecret } = await revealEndpointSecret({ organizationId: getActionOrganizationId(context), endpointId });
    return { ok: true, message: "Signing secret", data: { secret, previousSecret } };
  });
}

export async function rotateSecret(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/rotateSecret", endpointIdSchema, formData, async ({ endpointId }, context) => {
    const { previousSecretExpiresAt } = await rotateEndpointSecret({ organizationId: getActionOrganizationId(context), endpointId });
    revalidatePath("/integrations/webhooks");
    return { ok: true, message: `New secret issued. Both secrets sign deliveries until ${formatDateTime(previousSecretExpiresAt)}.` };
  });
}

export async function sendTestEvent(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/sendTestEvent", endpointIdSchema, formData, async ({ endpointId }, context) => {
    const { eventId } = await sendTest({ organizationId: getActionOrganizationId(context), endpointId });
    revalidatePath("/integrations/webhooks/deliveries");
    return { ok: true, message: `Test event ${eventId} queued. See it in the delivery log.` };
  });
}

const deliverySchema = z.object({ deliveryId: idSchema("whd") });

export async function resendDelivery(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/resendDelivery", deliverySchema, formData, async ({ deliveryId }, context) => {
    await resendOne({ organizationId: getActionOrganizationId(context), deliveryId });
    revalidatePath("/integrations/webhooks/deliveries");
    return { ok: true, message: "Resent with the same webhook-id." };
  });
}

const sinceSchema = z.object({
  since: z
    .string({ error: "Choose a date and time." })
    .trim()
    .min(1, "Choose a date and time.")
    .refine((v) => !Number.isNaN(Date.parse(v.length === 16 ? `${v}:00Z` : v)), "Enter a date and time like 2026-12-01T09:00."),
  endpointId: z.union([idSchema("wh"), z.literal("")]).optional(),
});

export async function resendFailedSince(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("webhooks/resendFailedSince", sinceSchema, formData, async ({ since, endpointId }, context) => {
    // A datetime-local value has no zone; the form states it is UTC.
    const at = new Date(since.length === 16 ? `${since}:00Z` : since);
    const count = await resendSince({ organizationId: getActionOrganizationId(context), since: at, endpointId: endpointId || undefined });
    revalidatePath("/integrations/webhooks/deliveries");
    return { ok: true, message: count === 0 ? "No failed deliveries since then." : `Resent ${count} failed ${count === 1 ? "delivery" : "deliveries"}.` };
  });
}
