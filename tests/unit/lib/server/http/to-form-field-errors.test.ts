// Server-side errors land beside the form control they concern: a domain error's JSON pointer
// names the control by its first segment.
import { describe, expect, it } from "vitest";

import { toFormFieldErrors, toFormFieldName } from "@/lib/server/http/to-form-field-errors";

describe("toFormFieldName", () => {
  it.each([
    [{ pointer: "/name" }, "name"],
    [{ pointer: "/definition/combinations/0/limit" }, "definition"],
    [{ pointer: "/a~1b" }, "a/b"],
    [{ pointer: "email" }, "email"],
    [{ column: "iMm4" }, "iMm4"],
    [{ pointer: "/" }, "form"],
    [{}, "form"],
  ])("%j belongs to %s", (error, field) => {
    expect(toFormFieldName(error)).toBe(field);
  });
});

describe("toFormFieldErrors", () => {
  it("keeps every message of a field, joined, and the fields apart", () => {
    const errors = toFormFieldErrors([
      { pointer: "/name", message: "already in use" },
      { pointer: "/source", message: "must be 1 to 500 characters" },
      { pointer: "/name", message: "must be 1 to 100 characters" },
    ]);
    expect(errors).toEqual({ name: "already in use; must be 1 to 100 characters", source: "must be 1 to 500 characters" });
  });

  it("bounds a long list to one readable message", () => {
    const errors = toFormFieldErrors(Array.from({ length: 1000 }, (_, i) => ({ pointer: "/definition", message: `problem ${i}` })));
    expect(errors.definition!.length).toBe(2000);
  });
});
