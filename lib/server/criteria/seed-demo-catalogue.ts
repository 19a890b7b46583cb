import { readFileSync } from "node:fs";

import { getSql } from "@/db/client";
import { demoCatalogue } from "@/db/seed-data";

import { readCatalogueJson } from "./read-catalogue-rows";
import { importSectionCatalogue } from "./section-catalogues";

/** Seeds the demo's invented catalogue into the organization once (idempotent: skipped when a catalogue of that name exists). */
export async function seedDemoCatalogue(organizationId: string): Promise<void> {
  const [existing] = await getSql()`select 1 from section_catalogues where organization_id = ${organizationId} and lower(name) = lower(${demoCatalogue.name})`;
  if (existing) return;
  const read = readCatalogueJson(JSON.parse(readFileSync(demoCatalogue.file, "utf8")), "");
  if (!read.ok) throw new Error(`${demoCatalogue.file}: ${read.errors[0]?.pointer} ${read.errors[0]?.message}`);
  await importSectionCatalogue({ organizationId, name: demoCatalogue.name, source: demoCatalogue.source, inUse: true, sections: read.sections });
}
