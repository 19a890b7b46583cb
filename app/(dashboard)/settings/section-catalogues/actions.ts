"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { importCatalogueCsv, importCatalogueJson, MAX_CATALOGUE_FILE_BYTES } from "@/lib/server/criteria/import-catalogue-file";
import { deleteSectionCatalogue, setSectionCatalogueInUse } from "@/lib/server/criteria/section-catalogues";
import { DomainError, type FieldError } from "@/lib/server/errors";
import { idSchema } from "@/lib/server/validation";

const importSchema = z.object({
  name: z.string({ error: "Enter a name." }).trim().min(1, "Enter a name.").max(100, "Use at most 100 characters."),
  source: z.string({ error: "Say where the properties come from." }).trim().min(1, "Say where the properties come from.").max(500, "Use at most 500 characters."),
  inUse: z.string().optional(),
  file: z.instanceof(Blob, { error: "Choose a CSV or JSON file." }),
});

/** Row problems as one message on the file field: row, column and reason, the first few. */
function describeRowErrors(errors: readonly FieldError[]): string {
  const shown = errors.slice(0, 20).map((e) => `${e.row === undefined ? e.pointer : `row ${e.row}`}${e.column ? `, ${e.column}` : ""}: ${e.message}`);
  return shown.join("; ") + (errors.length > shown.length ? `; and ${errors.length - shown.length} more` : "");
}

export async function importCatalogue(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("section-catalogues/importCatalogue", importSchema, formData, async (input, context) => {
    if (input.file.size === 0) throw new DomainError("invalid_input", "Choose a CSV or JSON file.", [{ pointer: "file", message: "the file is empty" }]);
    if (input.file.size > MAX_CATALOGUE_FILE_BYTES) throw new DomainError("too_large", `The file is over ${MAX_CATALOGUE_FILE_BYTES / (1024 * 1024)} MB.`, [{ pointer: "file", message: "too large" }]);
    const text = await input.file.text();
    const name = input.file instanceof File ? input.file.name.toLowerCase() : "";
    const target = { organizationId: getActionOrganizationId(context), name: input.name, source: input.source, inUse: input.inUse === "on", userId: context!.user.id };
    try {
      const catalogue = name.endsWith(".json") ? await importCatalogueJson(target, parseJson(text), "") : await importCatalogueCsv(target, text);
      revalidatePath("/settings/section-catalogues");
      return { ok: true, message: `Imported ${catalogue.sectionCount} sections into ${catalogue.name}.` };
    } catch (error) {
      if (error instanceof DomainError && error.code === "invalid_input" && error.errors.some((e) => e.row !== undefined)) {
        throw new DomainError("invalid_input", error.message, [{ pointer: "file", message: describeRowErrors(error.errors) }]);
      }
      throw error;
    }
  });
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new DomainError("invalid_input", "The file is not valid JSON.", [{ pointer: "file", message: (error as Error).message.slice(0, 120) }]);
  }
}

export async function setCatalogueInUse(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("section-catalogues/setCatalogueInUse", z.object({ catalogueId: idSchema("cat"), inUse: z.enum(["true", "false"]) }), formData, async (input, context) => {
    const catalogue = await setSectionCatalogueInUse(getActionOrganizationId(context), input.catalogueId, input.inUse === "true");
    revalidatePath("/settings/section-catalogues");
    return { ok: true, message: catalogue.inUse ? `${catalogue.name} is in use for schedules submitted from now on.` : `${catalogue.name} is out of use for schedules submitted from now on.` };
  });
}

export async function deleteCatalogue(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("section-catalogues/deleteCatalogue", z.object({ catalogueId: idSchema("cat") }), formData, async ({ catalogueId }, context) => {
    await deleteSectionCatalogue(getActionOrganizationId(context), catalogueId);
    revalidatePath("/settings/section-catalogues");
    return { ok: true, message: "Catalogue removed. Schedules already submitted keep the sections they were checked with." };
  });
}
