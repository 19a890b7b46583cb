// Contract test of the OpenAPI document: its shape, that every $ref resolves, that it lists every
// route of the access table with that table's scope, and that the embedded schemas still validate.
import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";

import { SAFETY_CAUTION } from "@/lib/safety";
import { apiRouteScopes } from "@/lib/server/auth/api-access-table";
import { buildOpenApiDocument, getApiLimits } from "@/lib/server/openapi/build-openapi";

const limits = getApiLimits({ perKeyPerMinute: 600, perOrganizationPerMinute: 1200 });
const document = buildOpenApiDocument({ serverUrl: "http://127.0.0.1:3790", limits }) as unknown as Record<string, unknown> & {
  paths: Record<string, Record<string, Record<string, unknown>>>;
  components: { schemas: Record<string, unknown>; securitySchemes: Record<string, unknown> };
  info: { description: string; title: string; version: string };
};

function collectRefs(node: unknown, at: string, out: [string, string][]): [string, string][] {
  if (Array.isArray(node)) node.forEach((item, i) => collectRefs(item, `${at}/${i}`, out));
  else if (node && typeof node === "object") {
    for (const [key, value] of Object.entries(node)) {
      if (key === "$ref" && typeof value === "string") out.push([at, value]);
      else collectRefs(value, `${at}/${key}`, out);
    }
  }
  return out;
}

function resolvePointer(root: unknown, ref: string): unknown {
  if (!ref.startsWith("#/")) return undefined;
  let node: unknown = root;
  for (const raw of ref.slice(2).split("/")) {
    const part = decodeURIComponent(raw).replaceAll("~1", "/").replaceAll("~0", "~");
    if (!node || typeof node !== "object" || !(part in node)) return undefined;
    node = (node as Record<string, unknown>)[part];
  }
  return node;
}

describe("GET /api/v1/openapi.json document", () => {
  it("is OpenAPI 3.1 with info, a bearer security scheme and paths", () => {
    expect(document.openapi).toMatch(/^3\.1\.\d+$/);
    expect(document.info.title).toBe("Sagline API");
    expect(document.info.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(document.components.securitySchemes).toEqual({ apiKey: expect.objectContaining({ type: "http", scheme: "bearer" }) });
    expect(Object.keys(document.paths).length).toBeGreaterThan(0);
  });

  it("resolves every $ref inside the document", () => {
    const refs = collectRefs(document, "#", []);
    expect(refs.length).toBeGreaterThan(20);
    const broken = refs.filter(([, ref]) => resolvePointer(document, ref) === undefined);
    expect(broken).toEqual([]);
  });

  it("describes exactly the routes of the access table, each with the table's scope", () => {
    const described: string[] = [];
    for (const [path, methods] of Object.entries(document.paths)) {
      for (const [method, operation] of Object.entries(methods)) {
        const key = `${method.toUpperCase()} ${path.replace(/\{([^}]+)\}/g, "[$1]")}`;
        described.push(key);
        const scope = apiRouteScopes[key as keyof typeof apiRouteScopes];
        expect(operation["x-sagline-scope"], key).toBe(scope);
        expect(operation.security, key).toEqual(scope === "public" || scope === "signed-link" ? [] : [{ apiKey: [scope] }]);
        expect(Object.keys(operation.responses as object).length, key).toBeGreaterThan(0);
        expect(typeof operation.operationId, key).toBe("string");
      }
    }
    expect(described.sort()).toEqual(Object.keys(apiRouteScopes).sort());
  });

  it("declares every path parameter, and answers errors as problem+json", () => {
    for (const [path, methods] of Object.entries(document.paths)) {
      const names = [...path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]);
      for (const [method, operation] of Object.entries(methods)) {
        const declared = ((operation.parameters ?? []) as { name: string; in: string }[]).filter((p) => p.in === "path").map((p) => p.name);
        expect(declared.sort(), `${method} ${path}`).toEqual([...names].sort());
        for (const [status, response] of Object.entries(operation.responses as Record<string, { content?: Record<string, unknown> }>)) {
          if (Number(status) >= 400) expect(Object.keys(response.content ?? {}), `${method} ${path} ${status}`).toEqual(["application/problem+json"]);
        }
      }
    }
  });

  it("takes schedule bodies as JSON (the schedule schema), CSV and multipart with a file part", () => {
    const post = document.paths["/api/v1/schedules"]!.post as { requestBody: { content: Record<string, { schema: Record<string, unknown> }> }; parameters: { name: string; in: string }[] };
    expect(Object.keys(post.requestBody.content).sort()).toEqual(["application/json", "multipart/form-data", "text/csv"]);
    expect(post.requestBody.content["application/json"]!.schema).toEqual({ $ref: "#/components/schemas/Schedule" });
    expect(post.requestBody.content["multipart/form-data"]!.schema).toMatchObject({ required: ["file"] });
    expect(post.parameters).toEqual(expect.arrayContaining([expect.objectContaining({ name: "Idempotency-Key", in: "header" }), expect.objectContaining({ name: "delimiter" }), expect.objectContaining({ name: "units" })]));
    const results = document.paths["/api/v1/schedules/{scheduleId}/results"]!.get as { parameters: { name: string }[] };
    expect(results.parameters.map((p) => p.name)).toEqual(expect.arrayContaining(["format", "status", "category", "cursor", "limit"]));
  });

  it("describes the webhook events with their contract schemas (OpenAPI 3.1 webhooks)", () => {
    const webhooks = (document as unknown as { webhooks: Record<string, { post: { requestBody: { content: Record<string, { schema: { $ref: string } }> } } }> }).webhooks;
    expect(Object.keys(webhooks)).toEqual(expect.arrayContaining(["schedule.completed", "schedule.failed", "webhook.test"]));
    const ref = webhooks["schedule.completed"]!.post.requestBody.content["application/json"]!.schema.$ref;
    expect(resolvePointer(document, ref)).toMatchObject({ title: "schedule.completed" });
  });

  it("states the safety caution and the limits", () => {
    const text = document.info.description;
    expect(text).toContain(SAFETY_CAUTION);
    expect(text).toContain("100,000 members per schedule");
    expect(text).toContain("64 MB");
    expect(text).toContain("expire after 24 hours");
    expect(text).toContain("600 requests a minute per API key");
    expect(text).toContain("1200 a minute per organization");
  });

  it("embeds the contract schemas so they still validate through the document", () => {
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    addFormats(ajv);
    ajv.addSchema({ ...document, $id: "https://sagline.example/openapi.json" });
    const created = ajv.getSchema("https://sagline.example/openapi.json#/components/schemas/ApiKeyCreated")!;
    const apiKey = {
      id: "key_abc",
      name: "n",
      prefix: "sgl_AbCdEfGh",
      scopes: ["results:read"],
      status: "active",
      createdBy: null,
      createdAt: "2026-01-01T00:00:00.000Z",
      lastUsedAt: null,
      expiresAt: null,
      revokedAt: null,
    };
    expect(created({ apiKey, key: `sgl_${"A".repeat(38)}` }), JSON.stringify(created.errors)).toBe(true);
    expect(created({ apiKey: { ...apiKey, secretHash: "x" }, key: `sgl_${"A".repeat(38)}` })).toBe(false);
    const schedule = ajv.getSchema("https://sagline.example/openapi.json#/components/schemas/Schedule")!;
    expect(schedule({ format: "sagline.schedule/v2" })).toBe(false);
  });
});
