import { readFileSync } from "node:fs";

import { getSql } from "@/db/client";
import { demoCatalogue } from "@/db/seed-data";
import type { CatalogueSection } from "@/lib/engine/model";
import { readCatalogueJson } from "@/lib/server/criteria/read-catalogue-rows";
import { createId } from "@/lib/server/ids";

/** A throwaway organization of the test's own (invented name), so its catalogues and profiles are the only ones. */
export async function createTestOrganization(label: string): Promise<string> {
  const id = createId("org");
  await getSql()`insert into organizations (id, name, kind) values (${id}, ${`Quenby Harrow Structures, ${label} (invented, test)`}, 'engineering')`;
  return id;
}

/** The demo's invented catalogue, read the way an import reads it. */
export function readDemoCatalogue(): CatalogueSection[] {
  const read = readCatalogueJson(JSON.parse(readFileSync(demoCatalogue.file, "utf8")), "");
  if (!read.ok) throw new Error("the demo catalogue no longer reads");
  return read.sections;
}

/** A simply supported steel floor beam named by catalogue section (SI; span m, loads kN/m). */
export function createCatalogueBeam(mark: string, section: string, spanM: number, liveKnPerM: number) {
  return {
    mark,
    category: "floor_beam",
    quantity: 1,
    material: "steel-s355",
    section,
    spans: [spanM],
    supports: ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 1 },
      { case: "live", type: "uniform", w: liveKnPerM },
    ],
  };
}
