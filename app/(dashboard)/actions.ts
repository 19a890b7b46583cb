"use server";

import { cookies } from "next/headers";
import { revalidatePath } from "next/cache";
import { z } from "zod";

import { runAction, type ActionResult } from "@/lib/server/auth/guards";
import { ACTIVE_ORG_COOKIE } from "@/lib/server/auth/request-context";
import { DomainError } from "@/lib/server/errors";
import { idSchema } from "@/lib/server/validation";

const switchSchema = z.object({ organizationId: idSchema("org") });

export async function switchOrganization(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("(dashboard)/switchOrganization", switchSchema, formData, async ({ organizationId }, context) => {
    // Only an organization the user belongs to; any other id reads as missing.
    if (!context?.memberships.some((m) => m.organizationId === organizationId)) {
      throw new DomainError("not_found", "That organization was not found.");
    }
    (await cookies()).set(ACTIVE_ORG_COOKIE, organizationId, { httpOnly: true, sameSite: "lax", path: "/" });
    revalidatePath("/", "layout");
    return { ok: true, message: "Switched." };
  });
}
