"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { createApiKey as create } from "@/lib/server/api-keys/create-api-key";
import { API_KEY_EXPIRES_DAYS_MAX, API_KEY_NAME_MAX_LENGTH } from "@/lib/server/api-keys/limits";
import { revokeApiKey as revoke } from "@/lib/server/api-keys/revoke-api-key";
import { apiKeyScopes } from "@/lib/server/api-keys/scopes";
import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { idSchema } from "@/lib/server/validation";

import { scopeFieldName } from "./scope-fields";

const scopeFields = Object.fromEntries(apiKeyScopes.map((s) => [scopeFieldName(s), z.literal("on").optional()]));

const createSchema = z
  .object({
    name: z
      .string({ error: "Give the key a name." })
      .trim()
      .min(1, "Give the key a name, e.g. the system that will use it.")
      .max(API_KEY_NAME_MAX_LENGTH, `Keep the name to ${API_KEY_NAME_MAX_LENGTH} characters.`)
      .refine((v) => !/[\u0000-\u001f\u007f]/.test(v), "The name contains control characters."),
    expiresInDays: z
      .string()
      .trim()
      .optional()
      .transform((v) => (v ? v : null))
      .refine((v) => v === null || (/^\d+$/.test(v) && Number(v) >= 1 && Number(v) <= API_KEY_EXPIRES_DAYS_MAX), `Use a whole number of days from 1 to ${API_KEY_EXPIRES_DAYS_MAX}, or leave it empty.`)
      .transform((v) => (v === null ? null : Number(v))),
    ...scopeFields,
  })
  .transform((input, ctx) => {
    const record = input as Record<string, unknown>;
    const scopes = apiKeyScopes.filter((s) => record[scopeFieldName(s)] === "on");
    if (scopes.length === 0) {
      ctx.addIssue({ code: "custom", path: ["scopes"], message: "Choose at least one scope." });
      return z.NEVER;
    }
    return { name: input.name, expiresInDays: input.expiresInDays, scopes };
  });

export type CreatedKey = { secret: string; name: string; prefix: string };

export async function createApiKey(_prev: ActionResult<CreatedKey> | null, formData: FormData): Promise<ActionResult<CreatedKey>> {
  return runAction("keys/createApiKey", createSchema, formData, async ({ name, scopes, expiresInDays }, context) => {
    const { apiKey, secret } = await create({ organizationId: getActionOrganizationId(context), name, scopes, expiresInDays, createdBy: { userId: context!.user.id, role: context!.active!.role } });
    revalidatePath("/integrations/keys");
    return { ok: true, message: `Key "${apiKey.name}" created.`, data: { secret, name: apiKey.name, prefix: apiKey.prefix } };
  });
}

const revokeSchema = z.object({ keyId: idSchema("key") });

export async function revokeApiKey(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("keys/revokeApiKey", revokeSchema, formData, async ({ keyId }, context) => {
    const madeByUserId = can(context, "integrations:manage") ? undefined : context!.user.id;
    const key = await revoke({ organizationId: getActionOrganizationId(context), keyId, madeByUserId });
    revalidatePath("/integrations/keys");
    return { ok: true, message: `Key "${key.name}" revoked. Requests with it are refused from now on.` };
  });
}
