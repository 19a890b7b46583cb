// Organization materials by id in schedules (JSON and CSV), frozen with the schedule; and catalogue
// imports whose every problem names its row and field, capped, with nothing half-written.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { readCatalogueCsv, readCatalogueJson } from "@/lib/server/criteria/read-catalogue-rows";
import { createOrganizationMaterial, updateOrganizationMaterial } from "@/lib/server/criteria/organization-materials";
import { importSectionCatalogue } from "@/lib/server/criteria/section-catalogues";
import { DomainError } from "@/lib/server/errors";
import { MAX_LISTED_ERRORS } from "@/lib/server/schedules/issue-pointers";
import { readCsvParameters, readScheduleCsv } from "@/lib/server/schedules/read-schedule-body";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

import { createTestOrganization, readDemoCatalogue } from "./support";

process.env.REDIS_PREFIX = `criteria-materials-${process.pid}-${Date.now()}`;

const HEADER = "name,iMm4,areaMm2,massKgPerM,shearAreaMm2";

describe("organization materials", () => {
  it("checks a member with the organization's material by id, and keeps the values it was checked with after an edit", async () => {
    const organizationId = await createTestOrganization("materials");
    // Invented values for an invented alloy; E half of steel's so the deflection doubles.
    const input = { name: "Verrel alloy 7 (invented)", family: "custom" as const, eMpa: 100_000, gMpa: 38_000, densityKgPerM3: 7_000, creepFactor: 0, source: "invented for this test" };
    const material = await createOrganizationMaterial(organizationId, input);
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    const steel = createBeam("S-1", 6, 7.5);
    const own = { ...createBeam("M-1", 6, 7.5), material: material.id };
    const { id } = await submitSchedule({ organizationId, source: "api-json", doc: createScheduleDoc([steel, own]) });
    await updateOrganizationMaterial(organizationId, material.id, { ...input, eMpa: 1_000_000 });
    await checkChunk(id, 0);
    const rows = await getSql()`select member_index, deflection_mm from member_checks where schedule_id = ${id} and check_key = 'live, span 1' order by member_index`;
    // deflection scales with 1/E (AISC Steel Construction Manual Table 3-23, case 1: 5wL^4/384EI):
    // S355 has E = 210,000 MPa (EN 1993-1-1 3.2.6), the material as submitted 100,000 MPa
    expect((rows[1]!.deflection_mm as number) / (rows[0]!.deflection_mm as number)).toBeCloseTo(210_000 / 100_000, 9);
    const [frozen] = await getSql()`select materials from schedule_criteria where schedule_id = ${id}`;
    expect(frozen!.materials).toEqual([expect.objectContaining({ id: material.id, eMpa: 100_000, family: "custom" })]);
  });

  it("reads an organization material id and profile id from a CSV schedule", async () => {
    const params = readCsvParameters((name) => ({ profile: "lp_abc123", name: "CSV with own criteria" })[name] ?? null, "x");
    expect(params.profile).toEqual({ id: "lp_abc123" });
    const csv = ["mark,category,quantity,material,section,span_1 [m],supports", "B-1,floor_beam,1,mat_abc123,KPG 240x120,8,pinned roller"].join("\n");
    const { doc } = await readScheduleCsv(new TextEncoder().encode(csv), { ...params, units: { system: "SI" } });
    expect((doc as { members: { material: string; section: unknown }[] }).members[0]).toMatchObject({ material: "mat_abc123", section: "KPG 240x120" });
  });
});

describe("section catalogue import", () => {
  it("names the row and the column of every CSV problem, names duplicates with case and spaces ignored, and stores nothing", () => {
    const csv = [HEADER, "KPG 200x100,18455902,2724.8,21.39,1024.8", "KPG 240x120,abc,3718.5,29.19,", "kpg 200 X100,1,1,1,", ",5,-2,3,"].join("\n");
    const read = readCatalogueCsv(csv);
    expect(read).toEqual({
      ok: false,
      errorCount: 4,
      errors: [
        { row: 3, column: "iMm4", code: "invalid_number", message: 'must be a positive number in mm^4, got "abc"' },
        { row: 4, column: "name", code: "duplicate_name", message: '"kpg 200 X100" is the same name as row 2 (names are compared with case and spaces ignored)' },
        { row: 5, column: "name", code: "missing_value", message: "is required: the section's name" },
        { row: 5, column: "areaMm2", code: "invalid_number", message: 'must be a positive number in mm^2, got "-2"' },
      ],
    });
  });

  it("names unknown and missing header columns", () => {
    expect(readCatalogueCsv("name,I,areaMm2\nA,1,1")).toEqual({
      ok: false,
      errorCount: 3,
      errors: [
        { row: 1, column: "I", code: "unknown_column", message: "unknown column; columns: name, iMm4, areaMm2, massKgPerM, shearAreaMm2" },
        { row: 1, column: "iMm4", code: "missing_column", message: "the header needs a iMm4 column" },
        { row: 1, column: "massKgPerM", code: "missing_column", message: "the header needs a massKgPerM column" },
      ],
    });
  });

  it("gives JSON problems their pointer and row", () => {
    const read = readCatalogueJson([{ name: "A", iMm4: 1, areaMm2: 1, massKgPerM: 1 }, { name: "B", iMm4: "1", areaMm2: 1, massKgPerM: 1, depth: 3 }], "/sections");
    expect(read).toEqual({
      ok: false,
      errorCount: 2,
      errors: [
        { pointer: "/sections/1/depth", row: 2, column: "depth", message: "unknown field; fields: name, iMm4, areaMm2, massKgPerM, shearAreaMm2" },
        { pointer: "/sections/1/iMm4", row: 2, column: "iMm4", message: "must be a number in mm^4" },
      ],
    });
  });

  it("caps the error list and counts the rest, and refuses more rows than a catalogue holds", () => {
    const bad = [HEADER, ...Array.from({ length: 1500 }, (_, i) => `S${i},x,1,1,`)].join("\n");
    const read = readCatalogueCsv(bad);
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.errors).toHaveLength(MAX_LISTED_ERRORS);
    expect(read.errorCount).toBe(1500);
    const many = [HEADER, ...Array.from({ length: 2001 }, (_, i) => `S${i},1,1,1,`)].join("\n");
    const tooMany = readCatalogueCsv(many);
    expect(tooMany.ok).toBe(false);
    if (!tooMany.ok) expect(tooMany.errors.at(-1)).toMatchObject({ code: "too_many_rows" });
  });

  it("refuses a second catalogue of the same name with a conflict and writes none of its sections", async () => {
    const organizationId = await createTestOrganization("import conflict");
    const sections = readDemoCatalogue();
    await importSectionCatalogue({ organizationId, name: "KPG (invented)", source: "invented", inUse: true, sections });
    const second = await importSectionCatalogue({ organizationId, name: "kpg (INVENTED)", source: "invented", inUse: false, sections }).catch((e: unknown) => e);
    expect((second as DomainError).code).toBe("conflict");
    const [counts] = await getSql()`
      select count(distinct c.id)::int as catalogues, count(s.*)::int as sections
      from section_catalogues c left join catalogue_sections s on s.catalogue_id = c.id where c.organization_id = ${organizationId}`;
    expect(counts).toEqual({ catalogues: 1, sections: sections.length });
  });
});
