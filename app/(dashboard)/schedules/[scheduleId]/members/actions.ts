"use server";

import { z } from "zod";

import { listMaterialIds } from "@/lib/engine/materials";
import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { recheckMember as recheck, WHAT_IF_SHAPES, type WhatIfChange, type WhatIfResult, type WhatIfShape } from "@/lib/server/schedules/recheck-member";
import { idSchema } from "@/lib/server/validation";

// Bounds on a trial value in the schedule's own units: intake applies each kind's physical range
// on top of this; these only keep absurd text out.
const MAX_TRIAL_VALUE = 1e15;

const trialNumber = z
  .string()
  .trim()
  .max(32, "Keep the number short.")
  .optional()
  .transform((v) => (v ? v : undefined))
  .refine((v) => v === undefined || (/^[0-9]*\.?[0-9]+(e[+-]?[0-9]+)?$/i.test(v) && Number(v) > 0 && Number(v) <= MAX_TRIAL_VALUE), "Enter a positive number.")
  .transform((v) => (v === undefined ? undefined : Number(v)));

const dimensionFields = [...new Set(Object.values(WHAT_IF_SHAPES).flat())];
const libraryIds = listMaterialIds().filter((id) => !id.includes("<"));

const whatIfSchema = z
  .object({
    scheduleId: idSchema("sch"),
    mark: z.string({ error: "Missing mark." }).min(1, "Missing mark.").max(64, "Unknown mark."),
    shape: z.enum(["keep", ...(Object.keys(WHAT_IF_SHAPES) as WhatIfShape[])], { error: "Choose a section or keep the member's own." }),
    material: z.string({ error: "Choose a material or keep the member's own." }).refine((v) => v === "keep" || v === "custom" || libraryIds.includes(v), "Choose a material from the list."),
    E: trialNumber,
    ...Object.fromEntries(dimensionFields.map((field) => [field, trialNumber])),
  })
  .transform((input, ctx) => {
    const record = input as Record<string, unknown>;
    let section: WhatIfChange["section"] = null;
    if (input.shape !== "keep") {
      const shape = input.shape;
      const dimensions: Record<string, number> = {};
      // the explicit shape's A is optional (only self-weight and frequency need it)
      for (const field of WHAT_IF_SHAPES[shape]) {
        const value = record[field];
        if (typeof value === "number") dimensions[field] = value;
        else if (!(shape === "explicit" && field === "A")) ctx.addIssue({ code: "custom", path: [field], message: `Enter ${field} for this section.` });
      }
      section = { shape, dimensions };
    }
    let material: WhatIfChange["material"] = null;
    if (input.material === "custom") {
      if (input.E === undefined) ctx.addIssue({ code: "custom", path: ["E"], message: "Enter E for the trial material." });
      else material = { eValue: input.E };
    } else if (input.material !== "keep") material = { id: input.material };
    if (section === null && material === null) ctx.addIssue({ code: "custom", path: ["form"], message: "Change the section or the material to recheck." });
    return { scheduleId: input.scheduleId, mark: input.mark, change: { section, material } };
  });

/** Rechecks one member with a trial section or material: computed on the spot, never stored. */
export async function recheckMember(_prev: ActionResult<WhatIfResult> | null, formData: FormData): Promise<ActionResult<WhatIfResult>> {
  return runAction("members/recheckMember", whatIfSchema, formData, async ({ scheduleId, mark, change }, context) => {
    const result = await recheck(getActionOrganizationId(context), scheduleId, mark, change);
    return { ok: true, message: result.ok ? "Rechecked. The record is unchanged." : "The trial could not be checked.", data: result };
  });
}
