import { describe, expect, it } from "vitest";

import { normaliseAddress, readClientAddress } from "@/lib/server/auth/client-address";

const withForwarded = (value: string | null) => new Headers(value === null ? {} : { "x-forwarded-for": value });

describe("readClientAddress", () => {
  it("takes the entry the nearest trusted proxy recorded", () => {
    expect(readClientAddress(withForwarded("203.0.113.9"), 0)).toBe("203.0.113.9");
    // One proxy in front: the client's own entries to the left are ignored.
    expect(readClientAddress(withForwarded("198.51.100.1, 203.0.113.9"), 1)).toBe("203.0.113.9");
    expect(readClientAddress(withForwarded("198.51.100.1, 203.0.113.9, 10.0.0.2"), 2)).toBe("203.0.113.9");
  });

  it("answers unknown without a usable entry", () => {
    expect(readClientAddress(withForwarded(null), 0)).toBe("unknown");
    expect(readClientAddress(withForwarded("not-an-address"), 0)).toBe("unknown");
  });
});

describe("normaliseAddress", () => {
  it("keys IPv4-mapped IPv6 as IPv4 and IPv6 by its /64", () => {
    expect(normaliseAddress("::ffff:192.0.2.7")).toBe("192.0.2.7");
    expect(normaliseAddress("2001:db8:1:2:aaaa::1")).toBe("2001:db8:1:2::/64");
    expect(normaliseAddress("2001:DB8:1:2:bbbb:cccc:dddd:eeee")).toBe("2001:db8:1:2::/64");
    expect(normaliseAddress("[2001:db8::1]")).toBe("2001:db8:0:0::/64");
    expect(normaliseAddress("fe80::1%eth0")).toBe("fe80:0:0:0::/64");
    expect(normaliseAddress("::1")).toBe("0:0:0:0::/64");
  });
});

describe("the tests' own addresses", () => {
  it("are valid and distinct, so each test sign-in counts on its own", async () => {
    const { nextTestAddress } = await import("@/tests/helpers/test-address");
    const keys = Array.from({ length: 200 }, () => normaliseAddress(nextTestAddress()));
    expect(keys).not.toContain("unknown");
    expect(new Set(keys).size).toBe(200);
  });
});
