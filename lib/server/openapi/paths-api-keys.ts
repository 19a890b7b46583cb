import { API_KEY_PAGE_DEFAULT, API_KEY_PAGE_MAX } from "@/lib/server/api-keys/limits";

import { jsonResponse, linkHeader, pageParameters, pathParameter, problemResponse, type Operation } from "./operations";

export const apiKeyOperations = {
  "GET /api/v1/api-keys": {
    operationId: "listApiKeys",
    tags: ["API keys"],
    summary: "List this organization's API keys",
    description: "Newest first. Shows each key's prefix, never the secret.",
    parameters: pageParameters(API_KEY_PAGE_MAX, API_KEY_PAGE_DEFAULT),
    responses: { "200": jsonResponse("One page of keys.", "ApiKeyList", linkHeader), "400": problemResponse("A bad `limit` or `cursor` (bad-request).") },
  },
  "POST /api/v1/api-keys": {
    operationId: "createApiKey",
    tags: ["API keys"],
    summary: "Create an API key",
    description: "The answer carries the full key once; Sagline stores only its SHA-256. A key can grant only scopes it holds; the new key expires no later than the key that made it (a later or missing expiresInDays is cut to that date) and is revoked with it.",
    requestBody: { required: true, content: { "application/json": { schema: { $ref: "#/components/schemas/ApiKeyCreate" } } } },
    responses: {
      "201": jsonResponse("Created; `key` is the secret, shown this once.", "ApiKeyCreated"),
      "413": problemResponse("Body over 64 KiB."),
      "415": problemResponse("Not application/json."),
      "422": problemResponse("Invalid body; errors[] lists {pointer, message}."),
    },
  },
  "DELETE /api/v1/api-keys/[keyId]": {
    operationId: "revokeApiKey",
    tags: ["API keys"],
    summary: "Revoke an API key",
    description: "Takes effect on the key's next request, for this key and every key made with it. Revoking again keeps the first revocation time.",
    parameters: [pathParameter("keyId", "The key's id (`key_...`), not its secret.")],
    responses: { "200": jsonResponse("The revoked key.", "ApiKey"), "404": problemResponse("No such key in this organization.") },
  },
} satisfies Record<string, Operation>;
