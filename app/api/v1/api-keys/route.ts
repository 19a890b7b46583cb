import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { API_KEY_PAGE_DEFAULT, API_KEY_PAGE_MAX } from "@/lib/server/api-keys/limits";
import { listApiKeys, type ApiKeyCursor } from "@/lib/server/api-keys/list-api-keys";
import { isCursorTimestamp } from "@/lib/server/http/cursor";

import { validateApiKeyCreate } from "../_lib/api-key-schemas";
import { buildNextLink, decodeCursor, encodeCursor, readPageQuery } from "../_lib/pagination";
import { readJsonBody } from "../_lib/validate-body";
import { withApiKey } from "../_lib/with-api-key";

export const dynamic = "force-dynamic";

function readKeyCursor(value: Record<string, unknown>): ApiKeyCursor | null {
  const { c, i } = value;
  if (!isCursorTimestamp(c) || typeof i !== "string" || !/^key_[0-9a-z]{1,40}$/.test(i)) return null;
  return { createdAt: new Date(c), id: i };
}

// GET /api/v1/api-keys: this organization's keys, newest first, keyset-paginated (Link rel="next").
export const GET = withApiKey("keys:manage", async (request, key) => {
  const url = new URL(request.url);
  const page = readPageQuery(url, { defaultLimit: API_KEY_PAGE_DEFAULT, maxLimit: API_KEY_PAGE_MAX });
  const after = page.cursor ? decodeCursor(page.cursor, readKeyCursor) : null;
  const { items, next } = await listApiKeys({ organizationId: key.organizationId, limit: page.limit, after });
  const nextCursor = next ? encodeCursor({ c: next.createdAt.toISOString(), i: next.id }) : null;
  const headers: Record<string, string> = { "cache-control": "no-store" };
  if (nextCursor) headers.link = buildNextLink(url, nextCursor);
  // links.next, as every list answers (docs/glossary.md): the same address as the Link header.
  const nextUrl = new URL(url);
  if (nextCursor) nextUrl.searchParams.set("cursor", nextCursor);
  return Response.json({ data: items, links: { next: nextCursor ? `${nextUrl.pathname}?${nextUrl.searchParams.toString()}` : null } }, { headers });
});

// POST /api/v1/api-keys: creates a key (only with scopes the calling key holds); the secret appears once.
export const POST = withApiKey("keys:manage", async (request, key) => {
  const body = await readJsonBody(request, validateApiKeyCreate);
  const { apiKey, secret } = await createApiKey({
    organizationId: key.organizationId,
    name: body.name,
    scopes: body.scopes,
    expiresInDays: body.expiresInDays ?? null,
    createdBy: { apiKeyId: key.apiKeyId, scopes: key.scopes },
  });
  return Response.json({ apiKey, key: secret }, { status: 201, headers: { "cache-control": "no-store" } });
});
