import { revokeApiKey } from "@/lib/server/api-keys/revoke-api-key";
import { DomainError } from "@/lib/server/errors";

import { withApiKey } from "../../_lib/with-api-key";

export const dynamic = "force-dynamic";

// DELETE /api/v1/api-keys/{keyId}: revokes a key of this organization; refused from its next request on.
export const DELETE = withApiKey<{ keyId: string }>("keys:manage", async (_request, key, { keyId }) => {
  // A malformed id cannot exist; it answers exactly like a missing one.
  if (!/^key_[0-9a-z]{1,40}$/.test(keyId)) throw new DomainError("not_found", "That API key was not found.");
  const apiKey = await revokeApiKey({ organizationId: key.organizationId, keyId });
  return Response.json(apiKey, { headers: { "cache-control": "no-store" } });
});
