import { DomainError } from "@/lib/server/errors";

import { readCatalogueCsv, readCatalogueJson, type CatalogueRowsResult } from "./read-catalogue-rows";
import { importSectionCatalogue, type CatalogueSummary } from "./section-catalogues";

/** The largest catalogue file read (2,000 sections of a few numbers fit many times over). */
export const MAX_CATALOGUE_FILE_BYTES = 2 * 1024 * 1024;

export interface CatalogueFileInput {
  organizationId: string;
  name: string;
  source: string;
  inUse: boolean;
  userId?: string | null;
}

function throwRowErrors(read: Extract<CatalogueRowsResult, { ok: false }>): never {
  const total = read.errorCount;
  throw new DomainError(
    "invalid_input",
    `The catalogue has ${total} problem${total === 1 ? "" : "s"}; nothing was stored.${total > read.errors.length ? ` The first ${read.errors.length} are listed.` : ""}`,
    read.errors,
    undefined,
    { errorCount: total },
  );
}

/** Validates every row of a CSV catalogue and stores it, all or nothing (422 naming row and column). */
export async function importCatalogueCsv(input: CatalogueFileInput, text: string): Promise<CatalogueSummary> {
  const read = readCatalogueCsv(text);
  if (!read.ok) throwRowErrors(read);
  return importSectionCatalogue({ ...input, sections: read.sections });
}

/** The same for a JSON array of sections; problems carry JSON pointers under `pointerBase` and the row (position from 1). */
export async function importCatalogueJson(input: CatalogueFileInput, sections: unknown, pointerBase: string): Promise<CatalogueSummary> {
  const read = readCatalogueJson(sections, pointerBase);
  if (!read.ok) throwRowErrors(read);
  return importSectionCatalogue({ ...input, sections: read.sections });
}
