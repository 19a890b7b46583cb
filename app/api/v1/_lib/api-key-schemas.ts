import createSchema from "@/api-schemas/v1/api-key-create.schema.json";

import { compileSchema } from "./validate-body";

export interface ApiKeyCreateBody {
  name: string;
  scopes: string[];
  expiresInDays?: number;
}

export const validateApiKeyCreate = compileSchema<ApiKeyCreateBody>(createSchema);
