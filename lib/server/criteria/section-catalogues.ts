import type { TransactionSql } from "postgres";

import type { CatalogueSection } from "@/lib/engine/model";
import { normaliseSectionName } from "@/lib/engine/sections";
import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import { lockCriteriaCaps } from "./lock-criteria-caps";
import { isUniqueViolation } from "./unique-violation";

/**
 * The most sections the organization's catalogues in use hold together: every submission freezes
 * them with the schedule (schedule_criteria), and the suggestion tries them per failing member.
 */
export const MAX_SECTIONS_IN_USE = 5000;

export interface CatalogueSummary {
  id: string;
  name: string;
  source: string;
  inUse: boolean;
  sectionCount: number;
  createdAt: string;
  updatedAt: string;
}

export interface ImportCatalogueInput {
  organizationId: string;
  name: string;
  source: string;
  inUse: boolean;
  sections: CatalogueSection[];
  userId?: string | null;
}

function toSummary(row: Record<string, unknown>): CatalogueSummary {
  return {
    id: row.id as string,
    name: row.name as string,
    source: row.source as string,
    inUse: row.in_use as boolean,
    sectionCount: row.section_count as number,
    createdAt: new Date(row.created_at as string).toISOString(),
    updatedAt: new Date(row.updated_at as string).toISOString(),
  };
}

function assertText(value: string, field: string, max: number): string {
  const text = value.trim();
  if (text === "" || text.length > max) throw new DomainError("invalid_input", `The catalogue's ${field} must be 1 to ${max} characters.`, [{ pointer: `/${field}`, message: `must be 1 to ${max} characters` }]);
  return text;
}

/** Call under lockCriteriaCaps, in the transaction that then writes: the sum stays true until it commits. */
async function assertRoomInUse(tx: TransactionSql, organizationId: string, adding: number, exceptCatalogueId: string | null): Promise<void> {
  const [row] = await tx`
    select coalesce(sum(section_count), 0)::int as total from section_catalogues
    where organization_id = ${organizationId} and in_use and id is distinct from ${exceptCatalogueId}`;
  const total = (row?.total as number) + adding;
  if (total > MAX_SECTIONS_IN_USE) {
    throw new DomainError("conflict", `The catalogues in use would hold ${total} sections; at most ${MAX_SECTIONS_IN_USE}. Take another catalogue out of use first.`, [
      { pointer: "/inUse", message: `would bring the sections in use to ${total}, over ${MAX_SECTIONS_IN_USE}` },
    ]);
  }
}

/** Stores a validated catalogue (read-catalogue-rows.ts) and all its sections in one transaction. */
export async function importSectionCatalogue(input: ImportCatalogueInput): Promise<CatalogueSummary> {
  const name = assertText(input.name, "name", 100);
  const source = assertText(input.source, "source", 500);
  const id = createId("cat");
  try {
    return await getSql().begin(async (tx) => {
      await lockCriteriaCaps(tx, input.organizationId);
      if (input.inUse) await assertRoomInUse(tx, input.organizationId, input.sections.length, null);
      const [row] = await tx`
        insert into section_catalogues (id, organization_id, name, source, in_use, section_count, created_by_user_id)
        values (${id}, ${input.organizationId}, ${name}, ${source}, ${input.inUse}, ${input.sections.length}, ${input.userId ?? null})
        returning *`;
      const rows = input.sections.map((s, position) => ({
        catalogue_id: id,
        position,
        name: s.name,
        name_key: normaliseSectionName(s.name),
        i_mm4: s.iMm4,
        area_mm2: s.areaMm2,
        mass_kg_per_m: s.massKgPerM,
        shear_area_mm2: s.shearAreaMm2 ?? null,
      }));
      // one multi-row insert per 1,000 sections keeps each statement well under PostgreSQL's parameter limit
      for (let start = 0; start < rows.length; start += 1000) await tx`insert into catalogue_sections ${tx(rows.slice(start, start + 1000))}`;
      return toSummary(row!);
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw new DomainError("conflict", `A catalogue named "${name}" already exists in this organization.`, [{ pointer: "/name", message: "already in use" }]);
    throw error;
  }
}

export async function listSectionCatalogues(organizationId: string): Promise<CatalogueSummary[]> {
  const rows = await getSql()`select * from section_catalogues where organization_id = ${organizationId} order by lower(name), id`;
  return rows.map(toSummary);
}

export async function getSectionCatalogueOrThrow(organizationId: string, catalogueId: string): Promise<CatalogueSummary & { sections: CatalogueSection[] }> {
  const sql = getSql();
  const [row] = await sql`select * from section_catalogues where id = ${catalogueId} and organization_id = ${organizationId}`;
  if (!row) throw new DomainError("not_found", "The section catalogue was not found.");
  const sections = await sql`select name, i_mm4, area_mm2, mass_kg_per_m, shear_area_mm2 from catalogue_sections where catalogue_id = ${catalogueId} order by position`;
  return { ...toSummary(row), sections: sections.map(toSection) };
}

function toSection(row: Record<string, unknown>): CatalogueSection {
  const section: CatalogueSection = { name: row.name as string, iMm4: row.i_mm4 as number, areaMm2: row.area_mm2 as number, massKgPerM: row.mass_kg_per_m as number };
  if (row.shear_area_mm2 !== null) section.shearAreaMm2 = row.shear_area_mm2 as number;
  return section;
}

export async function setSectionCatalogueInUse(organizationId: string, catalogueId: string, inUse: boolean): Promise<CatalogueSummary> {
  return getSql().begin(async (tx) => {
    await lockCriteriaCaps(tx, organizationId);
    const [current] = await tx`select section_count from section_catalogues where id = ${catalogueId} and organization_id = ${organizationId}`;
    if (!current) throw new DomainError("not_found", "The section catalogue was not found.");
    if (inUse) await assertRoomInUse(tx, organizationId, current.section_count as number, catalogueId);
    const [row] = await tx`update section_catalogues set in_use = ${inUse}, updated_at = now() where id = ${catalogueId} and organization_id = ${organizationId} returning *`;
    if (!row) throw new DomainError("not_found", "The section catalogue was not found.");
    return toSummary(row);
  });
}

/** Removes a catalogue; schedules already checked keep the sections they were checked with (schedule_criteria). */
export async function deleteSectionCatalogue(organizationId: string, catalogueId: string): Promise<void> {
  const rows = await getSql()`delete from section_catalogues where id = ${catalogueId} and organization_id = ${organizationId} returning id`;
  if (rows.length === 0) throw new DomainError("not_found", "The section catalogue was not found.");
}

/** The sections of every catalogue in use, catalogue by catalogue (by name) in file order. */
export async function loadCataloguesInUse(organizationId: string): Promise<{ catalogueIds: string[]; sections: CatalogueSection[] }> {
  const rows = await getSql()`
    select c.id as catalogue_id, s.name, s.i_mm4, s.area_mm2, s.mass_kg_per_m, s.shear_area_mm2
    from section_catalogues c join catalogue_sections s on s.catalogue_id = c.id
    where c.organization_id = ${organizationId} and c.in_use
    order by lower(c.name), c.id, s.position`;
  const catalogueIds = [...new Set(rows.map((r) => r.catalogue_id as string))];
  return { catalogueIds, sections: rows.map(toSection) };
}
