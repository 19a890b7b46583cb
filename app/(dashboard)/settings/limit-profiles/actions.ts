"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { createLimitProfile as create, deleteLimitProfile as remove, updateLimitProfile as update } from "@/lib/server/criteria/limit-profiles";
import { recheckSchedule as recheck } from "@/lib/server/criteria/recheck-schedule";
import { DomainError } from "@/lib/server/errors";
import { idSchema } from "@/lib/server/validation";

const MAX_DEFINITION_CHARS = 64 * 1024;

const labelSchema = z.string({ error: "Enter a label." }).trim().min(1, "Enter a label.").max(200, "Use at most 200 characters.");
const sourceSchema = z.string({ error: "Say which source the profile follows." }).trim().min(1, "Say which source the profile follows.").max(500, "Use at most 500 characters.");
const definitionSchema = z.string().max(MAX_DEFINITION_CHARS, `Keep the definition under ${MAX_DEFINITION_CHARS} characters.`).optional();

/** The definition textarea: JSON in the schedule's limits.custom format, or empty (keep the current one / copy the preset). */
function readDefinition(text: string | undefined): Record<string, unknown> | undefined {
  if (text === undefined || text.trim() === "") return undefined;
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new DomainError("invalid_input", "The definition is not valid JSON.", [{ pointer: "definition", message: `not valid JSON: ${(error as Error).message.slice(0, 120)}` }]);
  }
  if (typeof value !== "object" || value === null || Array.isArray(value)) throw new DomainError("invalid_input", "The definition must be a JSON object.", [{ pointer: "definition", message: "must be a JSON object" }]);
  return value as Record<string, unknown>;
}

/** Field errors point at /definition/...: on the form they all belong to the definition box. */
function toFormErrors(error: unknown): never {
  if (error instanceof DomainError && error.errors.some((e) => e.pointer?.startsWith("/definition"))) {
    const listed = error.errors.map((e) => `${e.pointer?.replace(/^\/definition/, "") || "/"}: ${e.message}`).join("; ");
    throw new DomainError(error.code, error.message, [{ pointer: "definition", message: listed.slice(0, 2000) }]);
  }
  throw error;
}

const createSchema = z.object({ label: labelSchema, source: sourceSchema, basedOnPreset: z.string().max(64).optional(), definition: definitionSchema });

export async function createLimitProfile(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("limit-profiles/createLimitProfile", createSchema, formData, async (input, context) => {
    const definition = readDefinition(input.definition);
    const preset = input.basedOnPreset === "" || definition !== undefined ? undefined : input.basedOnPreset;
    const profile = await create(getActionOrganizationId(context), { label: input.label, source: input.source, basedOnPreset: preset, definition }, context!.user.id).catch(toFormErrors);
    revalidatePath("/settings/limit-profiles");
    return { ok: true, message: `Profile ${profile.id} saved as version 1. Name it in a schedule as profile: {"id": "${profile.id}"}.` };
  });
}

const updateSchema = z.object({ profileId: idSchema("lp"), expectedVersion: z.coerce.number().int().positive(), label: labelSchema, source: sourceSchema, definition: definitionSchema });

export async function updateLimitProfile(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("limit-profiles/updateLimitProfile", updateSchema, formData, async (input, context) => {
    const profile = await update(
      getActionOrganizationId(context),
      input.profileId,
      { label: input.label, source: input.source, definition: readDefinition(input.definition), expectedVersion: input.expectedVersion },
      context!.user.id,
    ).catch(toFormErrors);
    revalidatePath(`/settings/limit-profiles/${input.profileId}`);
    return { ok: true, message: `Saved as version ${profile.version}. Schedules checked against earlier versions keep their results; their pages offer a recheck.` };
  });
}

const profileIdSchema = z.object({ profileId: idSchema("lp") });

export async function deleteLimitProfile(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("limit-profiles/deleteLimitProfile", profileIdSchema, formData, async ({ profileId }, context) => {
    await remove(getActionOrganizationId(context), profileId);
    revalidatePath("/settings/limit-profiles");
    return { ok: true, message: "Profile removed. Schedules checked against it keep the profile stored with them." };
  });
}

const recheckSchema = z.object({ scheduleId: idSchema("sch") });

export async function recheckSchedule(_prev: ActionResult<{ scheduleId: string }> | null, formData: FormData): Promise<ActionResult<{ scheduleId: string }>> {
  return runAction("limit-profiles/recheckSchedule", recheckSchema, formData, async ({ scheduleId }, context) => {
    const created = await recheck({ organizationId: getActionOrganizationId(context), scheduleId, submittedByUserId: context!.user.id });
    revalidatePath(`/schedules/${scheduleId}`);
    return { ok: true, message: `Recheck submitted as ${created.id}.`, data: { scheduleId: created.id } };
  });
}
