import type { Material } from "@/lib/engine/materials";
import type { CatalogueSection, LimitProfile } from "@/lib/engine/model";
import { getSql } from "@/db/client";

import { loadOrganizationMaterials } from "./organization-materials";
import { loadCataloguesInUse } from "./section-catalogues";

export interface UploadCriteriaData {
  catalogue: CatalogueSection[];
  materials: Material[];
  profiles: { id: string; version: number; profile: LimitProfile }[];
}

/**
 * What the upload page checks a CSV with in the browser, the same the server reads it with: the
 * catalogues in use, the organization's materials and each profile at its current version.
 */
export async function loadUploadCriteria(organizationId: string): Promise<UploadCriteriaData> {
  const [catalogues, materials, profiles] = await Promise.all([
    loadCataloguesInUse(organizationId),
    loadOrganizationMaterials(organizationId),
    getSql()`
      select p.id, v.version, v.resolved from limit_profiles p
      join limit_profile_versions v on v.profile_id = p.id and v.version = p.current_version
      where p.organization_id = ${organizationId} order by lower(p.label), p.id`,
  ]);
  return {
    catalogue: catalogues.sections,
    materials: [...materials.values()],
    profiles: profiles.map((row) => ({ id: row.id as string, version: row.version as number, profile: row.resolved as LimitProfile })),
  };
}
