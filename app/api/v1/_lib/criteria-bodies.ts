import limitProfileWriteSchema from "@/api-schemas/v1/limit-profile-write.schema.json";
import materialWriteSchema from "@/api-schemas/v1/material-write.schema.json";
import catalogueUpdateSchema from "@/api-schemas/v1/section-catalogue-update.schema.json";
import catalogueUploadSchema from "@/api-schemas/v1/section-catalogue-upload.schema.json";
import type { LimitProfileInput } from "@/lib/server/criteria/limit-profiles";
import type { MaterialInput } from "@/lib/server/criteria/organization-materials";
import { DomainError } from "@/lib/server/errors";

import { compileSchema } from "./validate-body";

export const validateLimitProfileWrite = compileSchema<LimitProfileInput>(limitProfileWriteSchema);
export const validateMaterialWrite = compileSchema<MaterialInput>(materialWriteSchema);
export const validateCatalogueUpload = compileSchema<{ name: string; source: string; inUse?: boolean; sections: unknown[] }>(catalogueUploadSchema);
export const validateCatalogueUpdate = compileSchema<{ inUse: boolean }>(catalogueUpdateSchema);

export const noStore = { "cache-control": "no-store" };

/** A malformed id cannot exist: it answers exactly like a missing one (or another organization's). */
export function assertIdShape(id: string, prefix: "lp" | "mat" | "cat", what: string): void {
  if (!new RegExp(`^${prefix}_[0-9a-z]{1,40}$`).test(id)) throw new DomainError("not_found", `The ${what} was not found.`);
}
