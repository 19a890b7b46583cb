"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { digestFrequencies } from "@/db/schema";
import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import type { RequestContext } from "@/lib/server/auth/request-context";
import { applyBulkDisposition as applyBulk, previewBulkDisposition as previewBulk } from "@/lib/server/review/bulk-disposition";
import { dispositionInputSchema, dispositionKindLabels, type DispositionActor } from "@/lib/server/review/disposition-input";
import { setDigestFrequency } from "@/lib/server/review/digest-preferences";
import { queueFilterSchema } from "@/lib/server/review/queue-filters";
import { recordDisposition as record } from "@/lib/server/review/record-disposition";

function actorOf(context: RequestContext | null): DispositionActor {
  return { kind: "user", userId: context!.user.id, name: context!.user.name };
}

// A form sends "" for an unset filter; the filter schema reads that as absent.
const emptyToUndefined = (v: unknown) => (v === "" ? undefined : v);
const bulkFilterSchema = z.object({
  scheduleId: z.preprocess(emptyToUndefined, queueFilterSchema.shape.scheduleId),
  projectId: z.preprocess(emptyToUndefined, queueFilterSchema.shape.projectId),
  category: z.preprocess(emptyToUndefined, queueFilterSchema.shape.category),
  governingCheck: z.preprocess(emptyToUndefined, queueFilterSchema.shape.governingCheck),
  utilizationAbove: z.preprocess(emptyToUndefined, queueFilterSchema.shape.utilizationAbove),
});

const recordSchema = z.object({ scheduleId: z.string().min(1).max(64), mark: z.string().min(1).max(200), kind: z.string(), justification: z.string().optional() });

export async function recordDisposition(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("review/recordDisposition", recordSchema, formData, async ({ scheduleId, mark, ...raw }, context) => {
    const input = dispositionInputSchema.safeParse(raw);
    if (!input.success) {
      const fieldErrors = Object.fromEntries(input.error.issues.map((i) => [String(i.path[0] ?? "form"), i.message]));
      return { ok: false, code: "invalid_input", message: "Please correct the highlighted fields.", fieldErrors };
    }
    const recorded = await record(getActionOrganizationId(context), scheduleId, mark, input.data, actorOf(context));
    revalidatePath(`/schedules/${scheduleId}/members/${encodeURIComponent(mark)}`);
    revalidatePath("/review");
    return { ok: true, message: `Recorded: ${dispositionKindLabels[recorded.kind]}, by ${recorded.decidedByName}.` };
  });
}

const bulkSchema = bulkFilterSchema.extend({ kind: z.string(), justification: z.string().optional() });

export async function previewBulkDisposition(_prev: ActionResult<{ count: number; overLimit: boolean }> | null, formData: FormData): Promise<ActionResult<{ count: number; overLimit: boolean }>> {
  return runAction("review/previewBulkDisposition", bulkSchema, formData, async ({ kind, justification, ...filter }, context) => {
    const input = dispositionInputSchema.safeParse({ kind, justification });
    if (!input.success) {
      const fieldErrors = Object.fromEntries(input.error.issues.map((i) => [String(i.path[0] ?? "form"), i.message]));
      return { ok: false, code: "invalid_input", message: "Please correct the highlighted fields.", fieldErrors };
    }
    const preview = await previewBulk(getActionOrganizationId(context), { ...filter, state: "awaiting_review" });
    return { ok: true, message: `${preview.count} members`, data: preview };
  });
}

const applySchema = bulkSchema.extend({ confirmedCount: z.coerce.number().int().min(1) });

export async function applyBulkDisposition(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("review/applyBulkDisposition", applySchema, formData, async ({ kind, justification, confirmedCount, ...filter }, context) => {
    const input = dispositionInputSchema.safeParse({ kind, justification });
    if (!input.success) {
      const fieldErrors = Object.fromEntries(input.error.issues.map((i) => [String(i.path[0] ?? "form"), i.message]));
      return { ok: false, code: "invalid_input", message: "Please correct the highlighted fields.", fieldErrors };
    }
    const result = await applyBulk(getActionOrganizationId(context), { ...filter, state: "awaiting_review" }, input.data, actorOf(context), confirmedCount);
    revalidatePath("/review");
    return { ok: true, message: `Recorded "${dispositionKindLabels[input.data.kind]}" on ${result.count} member${result.count === 1 ? "" : "s"} (bulk ${result.bulkId}).` };
  });
}

const digestSchema = z.object({ frequency: z.enum(digestFrequencies, { error: "Choose immediate, daily or none." }) });

export async function saveDigestPreference(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("review/saveDigestPreference", digestSchema, formData, async ({ frequency }, context) => {
    await setDigestFrequency(context!.user.id, getActionOrganizationId(context), frequency);
    revalidatePath("/review");
    return { ok: true, message: "Digest e-mail preference saved." };
  });
}
