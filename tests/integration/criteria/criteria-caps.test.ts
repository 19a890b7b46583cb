// The organization's criteria caps hold under concurrency: with room for exactly one more,
// several writes at once end with exactly the cap, the others refused with a conflict.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { createLimitProfile, MAX_LIMIT_PROFILES } from "@/lib/server/criteria/limit-profiles";
import { createOrganizationMaterial, MAX_ORGANIZATION_MATERIALS } from "@/lib/server/criteria/organization-materials";
import { importSectionCatalogue, MAX_SECTIONS_IN_USE, setSectionCatalogueInUse } from "@/lib/server/criteria/section-catalogues";
import { DomainError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import { createTestOrganization, readDemoCatalogue } from "./support";

const CONCURRENT_WRITES = 6;

/** Every write settled: exactly one stored, the rest refused as conflicts (never another error). */
function expectOneStored(results: PromiseSettledResult<unknown>[]): void {
  expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
  for (const r of results.filter((r): r is PromiseRejectedResult => r.status === "rejected")) {
    expect(r.reason).toBeInstanceOf(DomainError);
    expect((r.reason as DomainError).code).toBe("conflict");
  }
}

describe("criteria caps under concurrent writes", () => {
  it("limit profiles: at cap - 1, concurrent creations end with exactly the cap", async () => {
    const organizationId = await createTestOrganization("profile cap");
    const sql = getSql();
    const filler = Array.from({ length: MAX_LIMIT_PROFILES - 1 }, (_, i) => ({ id: createId("lp"), organization_id: organizationId, label: `Filler ${i}`, source: "invented for this test", current_version: 1 }));
    await sql`insert into limit_profiles ${sql(filler)}`;

    const results = await Promise.allSettled(
      Array.from({ length: CONCURRENT_WRITES }, (_, i) => createLimitProfile(organizationId, { label: `Concurrent ${i}`, source: "invented for this test", basedOnPreset: "ibc-2021-floor" })),
    );
    expectOneStored(results);
    const [row] = await sql`select count(*)::int as n from limit_profiles where organization_id = ${organizationId}`;
    expect(row!.n).toBe(MAX_LIMIT_PROFILES);
  });

  it("materials: at cap - 1, concurrent creations end with exactly the cap", async () => {
    const organizationId = await createTestOrganization("material cap");
    const sql = getSql();
    const filler = Array.from({ length: MAX_ORGANIZATION_MATERIALS - 1 }, (_, i) => ({
      id: createId("mat"),
      organization_id: organizationId,
      name: `Filler ${i}`,
      family: "steel",
      e_mpa: 210_000,
      source: "invented for this test",
    }));
    await sql`insert into organization_materials ${sql(filler)}`;

    const results = await Promise.allSettled(
      Array.from({ length: CONCURRENT_WRITES }, (_, i) => createOrganizationMaterial(organizationId, { name: `Concurrent ${i}`, family: "steel", eMpa: 200_000, source: "invented for this test" })),
    );
    expectOneStored(results);
    const [row] = await sql`select count(*)::int as n from organization_materials where organization_id = ${organizationId}`;
    expect(row!.n).toBe(MAX_ORGANIZATION_MATERIALS);
  });

  it("sections in use: with room for one more catalogue, concurrent imports and switches end with exactly the cap", async () => {
    const organizationId = await createTestOrganization("sections cap");
    const sql = getSql();
    const sections = readDemoCatalogue();
    expect(sections.length).toBeGreaterThan(1);
    // A catalogue in use that fills all but one catalogue's worth (its section rows are not needed to count).
    await sql`insert into section_catalogues (id, organization_id, name, source, in_use, section_count)
      values (${createId("cat")}, ${organizationId}, 'Filler (invented)', 'invented for this test', true, ${MAX_SECTIONS_IN_USE - sections.length})`;
    // Catalogues out of use, each of which would fill the last room if switched on.
    const spare = await Promise.all([0, 1].map((i) => importSectionCatalogue({ organizationId, name: `Spare ${i} (invented)`, source: "invented for this test", inUse: false, sections })));

    const results = await Promise.allSettled([
      ...Array.from({ length: CONCURRENT_WRITES - spare.length }, (_, i) => importSectionCatalogue({ organizationId, name: `Concurrent ${i} (invented)`, source: "invented for this test", inUse: true, sections })),
      ...spare.map((c) => setSectionCatalogueInUse(organizationId, c.id, true)),
    ]);
    expectOneStored(results);
    const [row] = await sql`select coalesce(sum(section_count), 0)::int as n from section_catalogues where organization_id = ${organizationId} and in_use`;
    expect(row!.n).toBe(MAX_SECTIONS_IN_USE);
  });
});
