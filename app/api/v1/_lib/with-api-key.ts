import type { ApiKeyScope } from "@/db/schema";
import { authenticateApiKey, touchApiKeyLastUsed, type ApiKeyContext } from "@/lib/server/api-keys/authenticate-api-key";
import { hasScope } from "@/lib/server/api-keys/scopes";
import { DomainError } from "@/lib/server/errors";
import { toProblem } from "@/lib/server/http/problem";

import { assertWithinRateLimit, type RateLimitDecision } from "./rate-limit";
import { assertNoKeyInUrl, readBearerToken } from "./read-api-key";

export type { ApiKeyContext };

/** What a route handler behind an API key receives: the request, the authenticated key, the route params. */
export type ApiKeyHandler<P> = (request: Request, key: ApiKeyContext, params: P) => Promise<Response>;

/** The function Next.js calls for a route export. */
export type ApiRouteHandler<P> = (request: Request, segment: { params: Promise<P> }) => Promise<Response>;

const REALM = 'Bearer realm="sagline"';

function assertScope(key: ApiKeyContext, scope: ApiKeyScope): void {
  if (!hasScope(key.scopes, scope)) {
    throw new DomainError("insufficient_scope", `This API key lacks the "${scope}" scope this request needs.`);
  }
}

// RFC 6750 section 3: tell the client which scheme, and for a scope failure which scope.
function addChallenge(response: Response, error: unknown, scope: ApiKeyScope): Response {
  if (!(error instanceof DomainError)) return response;
  if (error.code === "api_key_required") response.headers.set("www-authenticate", REALM);
  if (error.code === "invalid_api_key") response.headers.set("www-authenticate", `${REALM}, error="invalid_token"`);
  if (error.code === "insufficient_scope") response.headers.set("www-authenticate", `${REALM}, error="insufficient_scope", scope="${scope}"`);
  return response;
}

function addRateLimitHeaders(response: Response, decision: RateLimitDecision): Response {
  if (!decision.counted) return response;
  try {
    response.headers.set("ratelimit-limit", String(decision.limit));
    response.headers.set("ratelimit-remaining", String(decision.remaining));
    response.headers.set("ratelimit-reset", String(decision.resetSeconds));
  } catch {
    // A handler may return a response with immutable headers (e.g. a proxied fetch); the limit still applied.
  }
  return response;
}

async function recordUse(key: { apiKeyId: string; lastUsedAt: Date | null }): Promise<void> {
  try {
    await touchApiKeyLastUsed(key);
  } catch (error) {
    // Last-used is informational; failing to record it must not fail the request.
    console.warn(`[sagline] could not record last use of ${key.apiKeyId}`, error);
  }
}

/**
 * Wraps a public API route: refuse keys in the URL, read the Bearer key (cookies are ignored),
 * check checksum then hash, revoked and expired (401), scope (403), rate limits per key and per
 * organization (429), then run the handler. Every failure leaves as problem+json via toProblem.
 *
 *   export const POST = withApiKey("schedules:write", async (request, key, params) => ...)
 */
export function withApiKey<P = Record<string, never>>(scope: ApiKeyScope, handler: ApiKeyHandler<P>): ApiRouteHandler<P> {
  return async (request, segment) => {
    const url = new URL(request.url);
    try {
      assertNoKeyInUrl(url);
      const authenticated = await authenticateApiKey(readBearerToken(request.headers));
      const key: ApiKeyContext = { organizationId: authenticated.organizationId, apiKeyId: authenticated.apiKeyId, scopes: authenticated.scopes };
      assertScope(key, scope);
      const decision = await assertWithinRateLimit(key);
      await recordUse(authenticated);
      return addRateLimitHeaders(await handler(request, key, await segment.params), decision);
    } catch (error) {
      return addChallenge(toProblem(error, url.pathname), error, scope);
    }
  };
}
