import { readFileSync } from "node:fs";

import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";

import { DomainError, domainErrorCodes, type DomainErrorCode } from "@/lib/server/errors";
import { badOriginProblem, toProblem } from "@/lib/server/http/problem";
import { buildProblemSchema, listProblemTypes } from "@/lib/server/openapi/problem-types";

const file = JSON.parse(readFileSync(new URL("../../../../../api-schemas/v1/problem.schema.json", import.meta.url), "utf8"));
const ajv = new Ajv2020({ allErrors: true, strict: true });
addFormats(ajv);
const validate = ajv.compile(file);

describe("api-schemas/v1/problem.schema.json", () => {
  it("equals the schema derived from the error-code table (regenerate: npx tsx lib/server/openapi/print-problem-schema.ts > api-schemas/v1/problem.schema.json)", () => {
    expect(file).toEqual(buildProblemSchema());
  });

  it("lists one type per code plus internal, each once", () => {
    const types = listProblemTypes().map((p) => p.type);
    expect(new Set(types).size).toBe(types.length);
    expect(types).toHaveLength(Object.keys(domainErrorCodes).length + 1);
  });

  it("accepts what toProblem answers for every code, with the code's status and title", async () => {
    for (const code of Object.keys(domainErrorCodes) as DomainErrorCode[]) {
      const response = toProblem(new DomainError(code, "detail text"), "/api/v1/x");
      const body = await response.json();
      expect(response.headers.get("content-type")).toBe("application/problem+json");
      expect(body.status, code).toBe(response.status);
      expect(validate(body), `${code}: ${JSON.stringify(validate.errors)}`).toBe(true);
    }
  });

  it("accepts the internal-error and bad-origin answers", async () => {
    const original = console.error;
    console.error = () => {};
    try {
      expect(validate(await toProblem(new Error("boom")).json())).toBe(true);
    } finally {
      console.error = original;
    }
    expect(validate(await badOriginProblem("/x").json())).toBe(true);
  });

  it("refuses a type it does not list, or a type with another status", () => {
    expect(validate({ type: "https://sagline.dev/problems/made-up", title: "Made up", status: 400, detail: "d" })).toBe(false);
    expect(validate({ type: "https://sagline.dev/problems/not-found", title: "Not found", status: 400, detail: "d" })).toBe(false);
  });
});
