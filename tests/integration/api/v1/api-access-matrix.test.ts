// Every public API route against the API-key table (lib/server/auth/api-access-table.ts): a route
// file exporting a method without an entry fails; every listed route answers no key,
// a malformed, unknown, revoked or expired key with 401, a key without its scope with 403, a key in
// the URL with 400, and ignores a signed-in session cookie. A listed route whose file or method is
// missing fails, so the table cannot drift ahead of the routes.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";

import { eq } from "drizzle-orm";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { apiKeys, type ApiKeyScope } from "@/db/schema";
import { demoOrganizations } from "@/db/seed-data";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { composeApiKey } from "@/lib/server/api-keys/key-format";
import { revokeApiKey } from "@/lib/server/api-keys/revoke-api-key";
import { apiKeyScopes } from "@/lib/server/api-keys/scopes";
import { apiRouteScopes, type ApiRouteKey } from "@/lib/server/auth/api-access-table";
import { APP_URL, signInAs, type Agent } from "@/tests/helpers/app";

const PROBLEMS = "https://sagline.dev/problems/";

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? walk(path) : [path];
  });
}

function routePathOf(file: string): string {
  return "/" + relative("app", file).split("/").slice(0, -1).join("/");
}

function exportedMethodsOf(file: string): string[] {
  const source = readFileSync(file, "utf8");
  return [...source.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)].map((m) => m[1]!);
}

const routeFiles = walk("app/api/v1").filter((f) => f.endsWith("/route.ts"));
const existingKeys = new Set(routeFiles.flatMap((file) => exportedMethodsOf(file).map((m) => `${m} ${routePathOf(file)}`)));

function concrete(path: string): string {
  return path.replace(/\[keyId\]/, "key_doesnotexist0").replace(/\[[^\]]+\]/g, "doesnotexist0");
}

function withWrongChecksum(key: string): string {
  return key.slice(0, -1) + (key.endsWith("0") ? "1" : "0");
}

function send(method: string, url: string, authorization?: string, agent?: Agent) {
  const base = agent ?? request(APP_URL);
  const m = method.toLowerCase() as "get" | "post" | "patch" | "delete" | "put";
  let req = base[m](url).redirects(0);
  if (authorization !== undefined) req = req.set("Authorization", authorization);
  return req;
}

describe("the API-key table covers every public API route", () => {
  it("has an entry for every method every app/api/v1 route file exports", () => {
    const missing = [...existingKeys].filter((key) => !(key in apiRouteScopes));
    expect(missing).toEqual([]);
  });

  it("lists only methods some app/api/v1 route file exports", () => {
    const unknown = Object.keys(apiRouteScopes).filter((key) => !existingKeys.has(key));
    expect(unknown).toEqual([]);
  });

  it("found the route files it checks (the walk works)", () => {
    expect(existingKeys.has("GET /api/v1/openapi.json")).toBe(true);
    expect(existingKeys.has("DELETE /api/v1/api-keys/[keyId]")).toBe(true);
  });
});

describe("every listed route against no key, bad keys and the wrong scope", () => {
  // One key per situation, all in the demo engineering organization.
  const secrets = {} as Record<"revoked" | "expired", string> & { withoutScope: Partial<Record<ApiKeyScope, string>> };
  let sessionAgent: Agent;

  beforeAll(async () => {
    const organizationId = demoOrganizations.engineering.id;
    const all = { organizationId, scopes: [...apiKeyScopes], createdBy: { commandLine: true as const } };
    const revoked = await createApiKey({ ...all, name: "matrix revoked" });
    await revokeApiKey({ organizationId, keyId: revoked.apiKey.id });
    const expired = await createApiKey({ ...all, name: "matrix expired" });
    await getDb().update(apiKeys).set({ expiresAt: new Date(Date.now() - 60_000) }).where(eq(apiKeys.id, expired.apiKey.id));
    secrets.revoked = revoked.secret;
    secrets.expired = expired.secret;
    secrets.withoutScope = {};
    for (const scope of apiKeyScopes) {
      const other = apiKeyScopes.filter((s) => s !== scope);
      secrets.withoutScope[scope] = (await createApiKey({ ...all, name: `matrix without ${scope}`, scopes: other })).secret;
    }
    sessionAgent = await signInAs("admin");
  });

  const problem = (code: string, title: string, status: number) => ({ type: PROBLEMS + code, title, status });

  for (const [key, scope] of Object.entries(apiRouteScopes) as [ApiRouteKey, (typeof apiRouteScopes)[ApiRouteKey]][]) {
    const [method, path] = key.split(" ") as [string, string];
    const url = concrete(path);

    if (scope === "signed-link") {
      it(`${key} refuses a token it did not sign, without a key and with one`, async () => {
        const want = { type: PROBLEMS + "download-link-invalid", title: "Download link refused", status: 403 };
        for (const authorization of [undefined, `Bearer ${composeApiKey("UnknownKeyUnknownKeyUnknownKey00")}`]) {
          const response = await send(method, url, authorization);
          expect(response.status).toBe(403);
          expect(response.body).toMatchObject(want);
        }
      });
      continue;
    }

    if (scope === "public") {
      it(`${key} answers without a key`, async () => {
        const response = await send(method, url);
        expect(response.status).toBe(200);
      });
      continue;
    }

    it(`${key} needs a valid key with ${scope}`, async () => {
      const cases: [string, string | undefined, { type: string; title: string; status: number }][] = [
        ["no key", undefined, problem("api-key-required", "API key required", 401)],
        ["malformed key", "Bearer sgl_notakey", problem("invalid-api-key", "Invalid API key", 401)],
        ["wrong checksum", `Bearer ${withWrongChecksum(composeApiKey("A".repeat(32)))}`, problem("invalid-api-key", "Invalid API key", 401)],
        ["unknown key with a valid checksum", `Bearer ${composeApiKey("UnknownKeyUnknownKeyUnknownKey00")}`, problem("invalid-api-key", "Invalid API key", 401)],
        ["another scheme", `Basic ${secrets.expired}`, problem("invalid-api-key", "Invalid API key", 401)],
        ["revoked key", `Bearer ${secrets.revoked}`, problem("invalid-api-key", "Invalid API key", 401)],
        ["expired key", `Bearer ${secrets.expired}`, problem("invalid-api-key", "Invalid API key", 401)],
        ["key without the scope", `Bearer ${secrets.withoutScope[scope]}`, problem("insufficient-scope", "Insufficient scope", 403)],
      ];
      for (const [what, authorization, want] of cases) {
        const response = await send(method, url, authorization);
        const where = `${key} with ${what}`;
        expect(response.headers["content-type"], where).toBe("application/problem+json");
        expect({ type: response.body.type, title: response.body.title, status: response.body.status }, where).toEqual(want);
        expect(response.status, where).toBe(want.status);
        expect(response.body.instance, where).toBe(url);
        expect(typeof response.body.detail, where).toBe("string");
        expect(response.headers["www-authenticate"], where).toMatch(/^Bearer realm="sagline"/);
      }
      const revoked = await send(method, url, `Bearer ${secrets.revoked}`);
      expect(revoked.body.detail).toBe("The API key has been revoked.");
      const expired = await send(method, url, `Bearer ${secrets.expired}`);
      expect(expired.body.detail).toBe("The API key has expired.");
      const scopeFailure = await send(method, url, `Bearer ${secrets.withoutScope[scope]}`);
      expect(scopeFailure.headers["www-authenticate"]).toBe(`Bearer realm="sagline", error="insufficient_scope", scope="${scope}"`);
    });

    it(`${key} refuses a key in the URL and ignores a session cookie`, async () => {
      const inUrl = await send(method, `${url}?api_key=${secrets.withoutScope[scope]}`, `Bearer ${secrets.withoutScope[scope]}`);
      expect(inUrl.status).toBe(400);
      expect(inUrl.headers["content-type"]).toBe("application/problem+json");
      expect({ type: inUrl.body.type, title: inUrl.body.title, status: inUrl.body.status }).toEqual(problem("api-key-in-url", "API key in URL refused", 400));
      expect(inUrl.body.detail).toMatch(/Do not put API keys in URLs/);
      // A signed-in administrator's cookie carries no weight on the public API.
      const withCookie = await send(method, url, undefined, sessionAgent).set("Origin", APP_URL);
      expect(withCookie.status).toBe(401);
      expect(withCookie.body.type).toBe(PROBLEMS + "api-key-required");
    });
  }
});
