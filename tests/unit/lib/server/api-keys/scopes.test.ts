import { describe, expect, it } from "vitest";

import { adminScopes, apiKeyScopes, hasScope, isApiKeyScope, listGrantableScopes, listMissingScopes, scopeDescriptions } from "@/lib/server/api-keys/scopes";

describe("API key scopes", () => {
  it("are exactly the six the API checks, two of them administrative", () => {
    expect([...apiKeyScopes]).toEqual(["schedules:write", "results:read", "webhooks:manage", "keys:manage", "criteria:manage", "review:write"]);
    expect([...adminScopes]).toEqual(["webhooks:manage", "keys:manage"]);
    expect(Object.keys(scopeDescriptions).sort()).toEqual([...apiKeyScopes].sort());
  });

  it("grants only what a key holds", () => {
    expect(hasScope(["results:read"], "results:read")).toBe(true);
    expect(hasScope(["results:read"], "schedules:write")).toBe(false);
    expect(hasScope([], "keys:manage")).toBe(false);
    // No prefix or wildcard matching: "keys" is not "keys:manage".
    expect(hasScope(["keys", "*"], "keys:manage")).toBe(false);
  });

  it("lists the scopes a key cannot hand on", () => {
    expect(listMissingScopes(["keys:manage", "results:read"], ["results:read"])).toEqual([]);
    expect(listMissingScopes(["keys:manage"], ["schedules:write", "keys:manage", "webhooks:manage"])).toEqual(["schedules:write", "webhooks:manage"]);
  });

  it("recognises scope names exactly", () => {
    expect(isApiKeyScope("results:read")).toBe(true);
    expect(isApiKeyScope("Results:Read")).toBe(false);
    expect(isApiKeyScope("results:write")).toBe(false);
  });
});

describe("scopes a role may grant", () => {
  it.each([
    ["admin", ["schedules:write", "results:read", "webhooks:manage", "keys:manage", "criteria:manage", "review:write"]],
    ["engineer", ["schedules:write", "results:read", "criteria:manage", "review:write"]],
    ["integrator", ["results:read", "webhooks:manage", "keys:manage"]],
    ["submitter", ["schedules:write", "results:read"]],
    ["viewer", ["results:read"]],
  ] as const)("%s: %j", (role, expected) => {
    expect(listGrantableScopes(role)).toEqual(expected);
  });
});
