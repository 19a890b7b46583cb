import { describe, expect, it } from "vitest";

import { KeyCreateUsageError, parseKeyCreateArgs } from "@/lib/server/api-keys/key-create-args";

describe("key:create arguments", () => {
  it("reads organization, name, scopes and expiry", () => {
    expect(parseKeyCreateArgs(["--org", "org_x", "--name", "Shop export", "--scopes", "schedules:write, results:read", "--expires-days", "30"])).toEqual({
      organizationId: "org_x",
      name: "Shop export",
      scopes: ["schedules:write", "results:read"],
      expiresInDays: 30,
    });
    expect(parseKeyCreateArgs(["--scopes", "results:read", "--name", "n", "--org", "org_x"]).expiresInDays).toBeNull();
  });

  it.each([
    [[], /--org is required/],
    [["--org", "org_x", "--scopes", "results:read"], /--name is required/],
    [["--org", "org_x", "--name", "n"], /--scopes is required/],
    [["--org", "org_x", "--name", "n", "--scopes", "results:read", "--expires-days", "0"], /--expires-days must be a whole number from 1 to 3650/],
    [["--org", "org_x", "--name", "n", "--scopes", "results:read", "--expires-days", "1.5"], /--expires-days/],
    [["--org", "--name", "n"], /--org needs a value/],
    [["--org", "a", "--org", "b"], /--org given twice/],
    [["--colour", "red"], /unknown argument --colour/],
  ])("refuses %j", (argv, message) => {
    expect(() => parseKeyCreateArgs(argv)).toThrow(KeyCreateUsageError);
    expect(() => parseKeyCreateArgs(argv)).toThrow(message);
  });
});
