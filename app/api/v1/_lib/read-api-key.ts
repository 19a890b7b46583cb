import { DomainError } from "@/lib/server/errors";

// Query parameters people reach for when a client cannot set headers; a key there ends up in logs.
const KEY_PARAMETER_NAMES = new Set(["api_key", "apikey", "api-key", "key", "access_token", "token", "authorization", "bearer"]);
const KEY_IN_TEXT = /sgl_[0-9A-Za-z]{20,}/;

/**
 * Refuses a request that carries a key in its query string, even when the header is right too:
 * URLs are logged by proxies and browsers, so the key should be treated as exposed.
 */
export function assertNoKeyInUrl(url: URL): void {
  for (const [name, value] of url.searchParams) {
    if (KEY_PARAMETER_NAMES.has(name.toLowerCase()) || KEY_IN_TEXT.test(value) || KEY_IN_TEXT.test(name)) {
      throw new DomainError(
        "api_key_in_url",
        `Do not put API keys in URLs (query parameter "${name.slice(0, 40)}"): they end up in logs. Send "Authorization: Bearer <key>" instead, and revoke a key that has been in a URL.`,
      );
    }
  }
}

/** The key from `Authorization: Bearer <key>`, the only place one is read (cookies are ignored). */
export function readBearerToken(headers: Headers): string {
  const header = headers.get("authorization");
  if (!header || !header.trim()) {
    throw new DomainError("api_key_required", 'Send an API key as "Authorization: Bearer <key>".');
  }
  const match = /^Bearer[ \t]+(\S+)[ \t]*$/i.exec(header.trim());
  if (!match?.[1]) {
    throw new DomainError("invalid_api_key", 'The Authorization header must be "Bearer <key>" with one key.');
  }
  return match[1];
}
