import type { Material } from "@/lib/engine/materials";
import { getSql } from "@/db/client";
import type { OrganizationMaterialFamily } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import { lockCriteriaCaps } from "./lock-criteria-caps";
import { isUniqueViolation } from "./unique-violation";

export const MAX_ORGANIZATION_MATERIALS = 500;

/**
 * An organization material as the API (api-schemas/v1/material-write.schema.json) and the settings
 * screen (its form schema) validate it, internal units. Concrete is left to the library
 * (concrete-fc<f'c>): its E, modulus of rupture and creep follow f'c.
 */
export interface MaterialInput {
  name: string;
  family: OrganizationMaterialFamily;
  eMpa: number;
  gMpa?: number | null;
  densityKgPerM3?: number | null;
  creepFactor?: number | null;
  source: string;
}

export interface OrganizationMaterialView {
  id: string;
  name: string;
  family: OrganizationMaterialFamily;
  eMpa: number;
  gMpa: number | null;
  densityKgPerM3: number | null;
  creepFactor: number | null;
  source: string;
  createdAt: string;
  updatedAt: string;
}

function toView(row: Record<string, unknown>): OrganizationMaterialView {
  return {
    id: row.id as string,
    name: row.name as string,
    family: row.family as OrganizationMaterialView["family"],
    eMpa: row.e_mpa as number,
    gMpa: (row.g_mpa as number | null) ?? null,
    densityKgPerM3: (row.density_kg_per_m3 as number | null) ?? null,
    creepFactor: (row.creep_factor as number | null) ?? null,
    source: row.source as string,
    createdAt: new Date(row.created_at as string).toISOString(),
    updatedAt: new Date(row.updated_at as string).toISOString(),
  };
}

/** The engine's material for an organization material: the id is the public one, the source says whose. */
export function toEngineMaterial(view: OrganizationMaterialView): Material {
  return {
    id: view.id,
    label: view.name,
    family: view.family,
    eMpa: view.eMpa,
    gMpa: view.gMpa,
    densityKgPerM3: view.densityKgPerM3,
    ...(view.creepFactor === null ? {} : { creepFactor: view.creepFactor }),
    source: `organization material ${view.id}: ${view.source}`,
  };
}

/** Name and source trimmed; blank after trimming is refused, naming the field. */
function readTexts(input: MaterialInput): MaterialInput {
  const name = input.name.trim();
  const source = input.source.trim();
  const errors = [
    ...(name === "" || name.length > 100 ? [{ pointer: "/name", message: "must be 1 to 100 characters" }] : []),
    ...(source === "" || source.length > 500 ? [{ pointer: "/source", message: "must be 1 to 500 characters: where the values come from" }] : []),
  ];
  if (errors.length > 0) throw new DomainError("invalid_input", "The material needs a name and a source.", errors);
  return { ...input, name, source };
}

function conflictOnName(error: unknown, name: string): never {
  if (isUniqueViolation(error)) throw new DomainError("conflict", `A material named "${name}" already exists in this organization.`, [{ pointer: "/name", message: "already in use" }]);
  throw error;
}

export async function listOrganizationMaterials(organizationId: string): Promise<OrganizationMaterialView[]> {
  const rows = await getSql()`select * from organization_materials where organization_id = ${organizationId} order by lower(name), id`;
  return rows.map(toView);
}

export async function getOrganizationMaterialOrThrow(organizationId: string, materialId: string): Promise<OrganizationMaterialView> {
  const [row] = await getSql()`select * from organization_materials where id = ${materialId} and organization_id = ${organizationId}`;
  if (!row) throw new DomainError("not_found", "The material was not found.");
  return toView(row);
}

export async function createOrganizationMaterial(organizationId: string, given: MaterialInput): Promise<OrganizationMaterialView> {
  const input = readTexts(given);
  try {
    return await getSql().begin(async (tx) => {
      await lockCriteriaCaps(tx, organizationId);
      const [count] = await tx`select count(*)::int as n from organization_materials where organization_id = ${organizationId}`;
      if ((count?.n as number) >= MAX_ORGANIZATION_MATERIALS) throw new DomainError("conflict", `The organization already has ${MAX_ORGANIZATION_MATERIALS} materials, the most it may hold.`);
      const [row] = await tx`
        insert into organization_materials (id, organization_id, name, family, e_mpa, g_mpa, density_kg_per_m3, creep_factor, source)
        values (${createId("mat")}, ${organizationId}, ${input.name}, ${input.family}, ${input.eMpa}, ${input.gMpa ?? null}, ${input.densityKgPerM3 ?? null},
          ${input.creepFactor ?? null}, ${input.source})
        returning *`;
      return toView(row!);
    });
  } catch (error) {
    conflictOnName(error, input.name);
  }
}

/** Changes a material for schedules submitted from now on; those already submitted keep the values they were checked with. */
export async function updateOrganizationMaterial(organizationId: string, materialId: string, given: MaterialInput): Promise<OrganizationMaterialView> {
  const input = readTexts(given);
  try {
    const [row] = await getSql()`
      update organization_materials set name = ${input.name}, family = ${input.family}, e_mpa = ${input.eMpa}, g_mpa = ${input.gMpa ?? null},
        density_kg_per_m3 = ${input.densityKgPerM3 ?? null}, creep_factor = ${input.creepFactor ?? null}, source = ${input.source}, updated_at = now()
      where id = ${materialId} and organization_id = ${organizationId}
      returning *`;
    if (!row) throw new DomainError("not_found", "The material was not found.");
    return toView(row);
  } catch (error) {
    conflictOnName(error, input.name);
  }
}

export async function deleteOrganizationMaterial(organizationId: string, materialId: string): Promise<void> {
  const rows = await getSql()`delete from organization_materials where id = ${materialId} and organization_id = ${organizationId} returning id`;
  if (rows.length === 0) throw new DomainError("not_found", "The material was not found.");
}

/** Every material of the organization as the engine reads it, by id. */
export async function loadOrganizationMaterials(organizationId: string): Promise<Map<string, Material>> {
  const views = await listOrganizationMaterials(organizationId);
  return new Map(views.map((view) => [view.id, toEngineMaterial(view)]));
}
