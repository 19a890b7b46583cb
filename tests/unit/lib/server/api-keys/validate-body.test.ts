import { describe, expect, it } from "vitest";

import { validateApiKeyCreate } from "@/app/api/v1/_lib/api-key-schemas";
import { readBodyText, readJsonBody, toFieldErrors } from "@/app/api/v1/_lib/validate-body";
import { DomainError } from "@/lib/server/errors";

function jsonRequest(body: string, contentType = "application/json"): Request {
  return new Request("https://x.example/api/v1/api-keys", { method: "POST", body, headers: { "content-type": contentType } });
}

async function problemOf(promise: Promise<unknown>): Promise<DomainError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  if (!(error instanceof DomainError)) throw new Error(`expected a DomainError, got ${String(error)}`);
  return error;
}

describe("readJsonBody with the api-key-create schema", () => {
  it("returns a valid body", async () => {
    const body = { name: "Shop export", scopes: ["results:read"], expiresInDays: 30 };
    await expect(readJsonBody(jsonRequest(JSON.stringify(body)), validateApiKeyCreate)).resolves.toEqual(body);
    // Parameters on the media type are fine.
    await expect(readJsonBody(jsonRequest(JSON.stringify(body), "application/json; charset=utf-8"), validateApiKeyCreate)).resolves.toEqual(body);
  });

  it("answers 415 for another content type", async () => {
    const error = await problemOf(readJsonBody(jsonRequest("{}", "text/plain"), validateApiKeyCreate));
    expect(error.code).toBe("unsupported_media_type");
    expect(error.message).toContain("application/json");
  });

  it("answers 400 for bad JSON and an empty body, never with a stack", async () => {
    const bad = await problemOf(readJsonBody(jsonRequest('{"name": '), validateApiKeyCreate));
    expect(bad.code).toBe("bad_request");
    expect(bad.message).toMatch(/^The request body is not valid JSON/);
    expect((await problemOf(readJsonBody(jsonRequest(""), validateApiKeyCreate))).code).toBe("bad_request");
  });

  it("answers 413 over the cap, declared or streamed", async () => {
    const big = JSON.stringify({ name: "x".repeat(70_000), scopes: ["results:read"] });
    expect((await problemOf(readJsonBody(jsonRequest(big), validateApiKeyCreate))).code).toBe("too_large");
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < 20; i++) controller.enqueue(new Uint8Array(1000).fill(32));
        controller.close();
      },
    });
    const streamed = new Request("https://x.example/", { method: "POST", body: stream, headers: { "content-type": "application/json" }, duplex: "half" } as RequestInit);
    expect((await problemOf(readBodyText(streamed, 10_000))).code).toBe("too_large");
  });

  it("answers 422 with one {pointer, message} per problem", async () => {
    const error = await problemOf(
      readJsonBody(jsonRequest(JSON.stringify({ scopes: ["results:read", "everything", "results:read"], expiresInDays: 0, colour: "red" })), validateApiKeyCreate),
    );
    expect(error.code).toBe("invalid_input");
    expect(error.errors).toEqual(
      expect.arrayContaining([
        { pointer: "/name", message: "is required." },
        { pointer: "/colour", message: "is not a known field." },
        { pointer: "/scopes/1", message: 'must be one of: "schedules:write", "results:read", "webhooks:manage", "keys:manage", "criteria:manage", "review:write".' },
        { pointer: "/expiresInDays", message: "must be >= 1." },
      ]),
    );
    expect(error.errors.some((e) => e.pointer === "/scopes" && e.message.includes("repeat"))).toBe(true);
  });

  it("refuses names that are blank or carry control characters", async () => {
    for (const name of ["   ", "a\u0000b", "line\nbreak", ""]) {
      const error = await problemOf(readJsonBody(jsonRequest(JSON.stringify({ name, scopes: ["results:read"] })), validateApiKeyCreate));
      expect(error.errors.map((e) => e.pointer), JSON.stringify(name)).toContain("/name");
    }
  });
});

describe("toFieldErrors", () => {
  it("escapes ~ and / in property names (RFC 6901 section 3)", () => {
    const errors = toFieldErrors([{ keyword: "additionalProperties", instancePath: "/a", schemaPath: "#", params: { additionalProperty: "x/y~z" } }]);
    expect(errors).toEqual([{ pointer: "/a/x~1y~0z", message: "is not a known field." }]);
  });
});
