// A schedule that names sections from an organization's catalogue: the names resolve (case and
// spaces ignored), and a failing member gets the lightest catalogue section that passes, written
// by the same code the worker runs. The engine then confirms the suggestion: the suggested section
// passes and the next lighter one fails.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { checkMember } from "@/lib/engine/check-member";
import { parseSchedule } from "@/lib/engine/intake";
import type { CatalogueSection } from "@/lib/engine/model";
import { importSectionCatalogue } from "@/lib/server/criteria/section-catalogues";
import { DomainError } from "@/lib/server/errors";
import { createScheduleDoc } from "@/tests/helpers/schedules";

import { createCatalogueBeam, createTestOrganization, readDemoCatalogue } from "./support";

// Jobs go to a queue prefix no worker listens on: this test runs the chunk itself, as the worker's job does.
process.env.REDIS_PREFIX = `criteria-suggest-${process.pid}-${Date.now()}`;

type Detail = { suggestion: { minIMm4: number; sectionName: string | null } | null; notes?: string[] } | null;

async function submitAndCheck(organizationId: string, members: unknown[]): Promise<{ id: string; outcomes: { member_index: number; pass: boolean; detail: Detail }[] }> {
  const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
  const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
  const { id } = await submitSchedule({ organizationId, source: "api-json", doc: createScheduleDoc(members, "Catalogue suggestion, Lumenbrook test (invented)") });
  expect(await checkChunk(id, 0)).toBe("checked");
  const outcomes = await getSql()<{ member_index: number; pass: boolean; detail: Detail }[]>`
    select member_index, pass, detail from member_outcomes where schedule_id = ${id} order by member_index`;
  return { id, outcomes };
}

/** Checks one member, its section replaced by a catalogue name, with the engine directly. */
function passesWith(member: ReturnType<typeof createCatalogueBeam>, sectionName: string, catalogue: CatalogueSection[]): boolean {
  const parsed = parseSchedule(createScheduleDoc([{ ...member, section: sectionName }]), { catalogue });
  if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; "));
  return checkMember(parsed.schedule.members[0]!, parsed.schedule.profile, catalogue).pass;
}

describe("an organization's section catalogue in schedules", () => {
  it("suggests the lightest passing section for a failing member; the engine confirms it passes and the next lighter fails", async () => {
    const organizationId = await createTestOrganization("catalogue suggestion");
    const sections = readDemoCatalogue();
    const catalogue = await importSectionCatalogue({ organizationId, name: "KPG plate girders (invented, test)", source: "invented for this test", inUse: true, sections });
    // 8 m simple span, live 20 kN/m: live l/360 = 22.2 mm needs I >= 5 w L^4 / (384 E 22.2 mm) = 2.29e8 mm^4
    // (AISC Steel Construction Manual Table 3-23, case 1; E = 210,000 MPa, EN 1993-1-1 3.2.6): between
    // KPG 400x180 (2.19e8) and KPG 450x190 (3.21e8). The name is spelled with other case and spaces.
    const failing = createCatalogueBeam("G-1", "kpg 240 X120", 8, 20);
    const passing = createCatalogueBeam("G-2", "KPG 500x200", 4, 2);
    const { id, outcomes } = await submitAndCheck(organizationId, [failing, passing]);

    expect(outcomes.map((o) => o.pass)).toEqual([false, true]);
    const suggested = outcomes[0]!.detail?.suggestion?.sectionName ?? null;
    expect(suggested).toBe("KPG 450x190");

    const byMass = [...sections].sort((a, b) => a.massKgPerM - b.massKgPerM);
    const at = byMass.findIndex((s) => s.name === suggested);
    expect(at).toBeGreaterThan(0);
    expect(passesWith(failing, suggested!, sections)).toBe(true);
    expect(passesWith(failing, byMass[at - 1]!.name, sections)).toBe(false);

    const [frozen] = await getSql()`select catalogue_ids, jsonb_array_length(catalogue) as sections from schedule_criteria where schedule_id = ${id}`;
    expect(frozen).toEqual({ catalogue_ids: [catalogue.id], sections: sections.length });
  });

  it("keeps checking with the catalogue frozen at submission when the catalogue is removed before the worker runs", async () => {
    const organizationId = await createTestOrganization("catalogue removed");
    const catalogue = await importSectionCatalogue({ organizationId, name: "KPG (invented, test)", source: "invented for this test", inUse: true, sections: readDemoCatalogue() });
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    const { id } = await submitSchedule({ organizationId, source: "api-json", doc: createScheduleDoc([createCatalogueBeam("G-1", "KPG 240x120", 8, 20)]) });
    await getSql()`delete from section_catalogues where id = ${catalogue.id}`;
    await checkChunk(id, 0);
    const [outcome] = await getSql()`select pass, detail from member_outcomes where schedule_id = ${id}`;
    expect(outcome!.detail).toMatchObject({ error: null, suggestion: { sectionName: "KPG 450x190" } });
  });

  it("refuses a section name that is in no catalogue in use, naming the member's field", async () => {
    const organizationId = await createTestOrganization("unknown section");
    await importSectionCatalogue({ organizationId, name: "KPG (invented, test)", source: "invented for this test", inUse: false, sections: readDemoCatalogue() });
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const refused = await submitSchedule({ organizationId, source: "api-json", doc: createScheduleDoc([createCatalogueBeam("G-1", "KPG 240x120", 8, 20)]) }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(DomainError);
    expect((refused as DomainError).errors).toEqual([{ pointer: "/members/0/section", message: 'section "KPG 240x120" is a catalogue name, but no catalogue was given' }]);
    const [stored] = await getSql()`select count(*)::int as n from schedules where organization_id = ${organizationId}`;
    expect(stored!.n).toBe(0);
  });
});
