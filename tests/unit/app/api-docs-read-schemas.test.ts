import { describe, expect, it } from "vitest";

import { buildCurl, buildExample, listSchemaFields } from "@/app/(dashboard)/api-docs/read-schemas";

const document = {
  components: {
    schemas: {
      Page: {
        type: "object",
        required: ["data", "links"],
        properties: {
          data: { type: "array", items: { $ref: "#/components/schemas/Row" } },
          links: { type: "object", required: ["next"], properties: { next: { type: ["string", "null"] } } },
        },
      },
      Row: { type: "object", required: ["id", "status"], properties: { id: { type: "string", pattern: "^sch_[0-9a-z]+$" }, status: { enum: ["pass", "fail", "error"], description: "The outcome." } } },
      Loop: { type: "object", properties: { self: { $ref: "#/components/schemas/Loop" } } },
    },
  },
};

describe("the API reference's schema reader", () => {
  it("lists fields through $ref and arrays", () => {
    expect(listSchemaFields(document, { $ref: "#/components/schemas/Page" })).toEqual([
      { path: "data", type: "array of object", required: true, description: "" },
      { path: "data[].id", type: "string", required: true, description: "" },
      { path: "data[].status", type: '"pass" | "fail" | "error"', required: true, description: "The outcome." },
      { path: "links", type: "object", required: true, description: "" },
      { path: "links.next", type: "string | null", required: true, description: "" },
    ]);
  });

  it("builds an example from the schema, and stops on a cycle", () => {
    expect(buildExample(document, { $ref: "#/components/schemas/Page" })).toEqual({ data: [{ id: "sch_...", status: "pass" }], links: { next: "text" } });
    expect(JSON.stringify(buildExample(document, { $ref: "#/components/schemas/Loop" })).length).toBeLessThan(200);
    expect(listSchemaFields(document, { $ref: "#/components/schemas/Loop" }).length).toBeLessThanOrEqual(60);
  });

  it("writes a curl line with the key only where the route needs one, quoting the body for the shell", () => {
    expect(buildCurl({ method: "GET", path: "/api/v1/schedules/{scheduleId}", serverUrl: "https://sagline.example/", needsKey: true, jsonBody: undefined, otherBodyType: null })).toBe(
      'curl -sS "https://sagline.example/api/v1/schedules/sch_..." \\\n  -H "authorization: Bearer $KEY"',
    );
    const post = buildCurl({ method: "POST", path: "/api/v1/things", serverUrl: "https://sagline.example", needsKey: false, jsonBody: { name: "O'Brien" }, otherBodyType: null });
    expect(post).toContain(`--data '{"name":"O'\\''Brien"}'`);
    expect(post).not.toContain("Bearer");
  });
});
