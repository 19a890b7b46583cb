"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { organizationMaterialFamilies } from "@/db/schema";
import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { createOrganizationMaterial, deleteOrganizationMaterial, updateOrganizationMaterial } from "@/lib/server/criteria/organization-materials";
import { idSchema } from "@/lib/server/validation";

const optionalNumber = (max: number, what: string) =>
  z.preprocess((v) => (v === "" || v === undefined ? null : v), z.coerce.number({ error: `Enter ${what} as a number.` }).positive(`${what} must be greater than 0.`).max(max).nullable());

const materialFormSchema = z.object({
  name: z.string({ error: "Enter a name." }).trim().min(1, "Enter a name.").max(100, "Use at most 100 characters."),
  family: z.enum(organizationMaterialFamilies, { error: "Choose the family." }),
  eMpa: z.coerce.number({ error: "Enter E in MPa." }).positive("E must be greater than 0.").max(1e7, "E is too large."),
  gMpa: optionalNumber(1e7, "G"),
  densityKgPerM3: optionalNumber(1e5, "Density"),
  creepFactor: z.preprocess((v) => (v === "" || v === undefined ? null : v), z.coerce.number({ error: "Enter the creep factor as a number." }).min(0, "The creep factor cannot be negative.").max(10).nullable()),
  source: z.string({ error: "Say where the values come from." }).trim().min(1, "Say where the values come from.").max(500, "Use at most 500 characters."),
});

export async function createMaterial(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("materials/createMaterial", materialFormSchema, formData, async (input, context) => {
    const material = await createOrganizationMaterial(getActionOrganizationId(context), input);
    revalidatePath("/settings/materials");
    return { ok: true, message: `Material added: name it in schedules as "${material.id}".` };
  });
}

export async function updateMaterial(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("materials/updateMaterial", materialFormSchema.extend({ materialId: idSchema("mat") }), formData, async ({ materialId, ...input }, context) => {
    await updateOrganizationMaterial(getActionOrganizationId(context), materialId, input);
    revalidatePath("/settings/materials");
    return { ok: true, message: "Material saved. Schedules already submitted keep the values they were checked with." };
  });
}

export async function deleteMaterial(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("materials/deleteMaterial", z.object({ materialId: idSchema("mat") }), formData, async ({ materialId }, context) => {
    await deleteOrganizationMaterial(getActionOrganizationId(context), materialId);
    revalidatePath("/settings/materials");
    return { ok: true, message: "Material removed." };
  });
}
