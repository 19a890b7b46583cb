import { describe, expect, it } from "vitest";

import { assertNoKeyInUrl, readBearerToken } from "@/app/api/v1/_lib/read-api-key";
import { DomainError } from "@/lib/server/errors";
import { createApiKeySecret } from "@/lib/server/api-keys/key-format";

function codeOf(run: () => unknown): string | null {
  try {
    run();
    return null;
  } catch (error) {
    return error instanceof DomainError ? error.code : "other";
  }
}

describe("keys in the URL", () => {
  const key = createApiKeySecret();
  it.each([
    `https://x.example/api/v1/schedules?api_key=${key}`,
    "https://x.example/api/v1/schedules?access_token=anything",
    "https://x.example/api/v1/schedules?API_KEY=anything",
    "https://x.example/api/v1/schedules?key=abc",
    `https://x.example/api/v1/schedules?cursor=${key}`,
    `https://x.example/api/v1/schedules?${key}`,
  ])("refuses %s with api_key_in_url", (url) => {
    expect(codeOf(() => assertNoKeyInUrl(new URL(url)))).toBe("api_key_in_url");
  });

  it("lets ordinary query parameters through", () => {
    expect(codeOf(() => assertNoKeyInUrl(new URL("https://x.example/api/v1/schedules?limit=5&cursor=eyJjIjoxfQ&status=fail&name=sgl_beam")))).toBeNull();
  });
});

describe("the Authorization header", () => {
  const key = createApiKeySecret();
  it("reads a Bearer key, scheme case-insensitive", () => {
    expect(readBearerToken(new Headers({ authorization: `Bearer ${key}` }))).toBe(key);
    expect(readBearerToken(new Headers({ authorization: `bearer   ${key} ` }))).toBe(key);
  });

  it("answers api_key_required with no header, invalid_api_key with any other shape", () => {
    expect(codeOf(() => readBearerToken(new Headers()))).toBe("api_key_required");
    expect(codeOf(() => readBearerToken(new Headers({ authorization: "  " })))).toBe("api_key_required");
    expect(codeOf(() => readBearerToken(new Headers({ authorization: `Basic ${key}` })))).toBe("invalid_api_key");
    expect(codeOf(() => readBearerToken(new Headers({ authorization: "Bearer" })))).toBe("invalid_api_key");
    expect(codeOf(() => readBearerToken(new Headers({ authorization: `Bearer ${key} ${key}` })))).toBe("invalid_api_key");
  });

  it("ignores cookies entirely", () => {
    expect(codeOf(() => readBearerToken(new Headers({ cookie: `sagline_key=${key}; next-auth.session-token=abc` })))).toBe("api_key_required");
  });
});
