// The environment half of the production start's refusals (the database half runs against the real
// test database in tests/integration/operations/production-start.test.ts).
import { describe, expect, it } from "vitest";

import { findProductionConfigProblems, isLoopbackHost } from "@/lib/server/operations/production-readiness";

const good = { SMTP_HOST: "smtp.mail-relay.example", WEBHOOK_ALLOWLIST: "hooks.partner.example:8443", SAGLINE_FAKES: "0", TRUSTED_PROXY_COUNT: "1" };

describe("isLoopbackHost", () => {
  it.each(["localhost", "LOCALHOST.", "api.localhost", "127.0.0.1", "127.5.6.7", "0.0.0.0", "::1", "[::1]", "0:0:0:0:0:0:0:1", "::", "::ffff:127.0.0.1", "::ffff:0.0.0.0"])("%s is loopback", (host) => {
    expect(isLoopbackHost(host)).toBe(true);
  });
  it.each(["smtp.mail-relay.example", "10.0.0.5", "128.0.0.1", "::2", "2001:db8::1", "localhost.example"])("%s is not", (host) => {
    expect(isLoopbackHost(host)).toBe(false);
  });
});

describe("findProductionConfigProblems", () => {
  it("accepts a real SMTP host, no fakes and a non-loopback allowlist", () => {
    expect(findProductionConfigProblems(good)).toEqual([]);
    expect(findProductionConfigProblems({ SMTP_HOST: "smtp.mail-relay.example", TRUSTED_PROXY_COUNT: "0" })).toEqual([]);
  });

  it.each([undefined, "", " "])("refuses TRUSTED_PROXY_COUNT=%s: the proxy count must be stated, 0 included", (count) => {
    expect(findProductionConfigProblems({ ...good, TRUSTED_PROXY_COUNT: count })).toEqual([expect.stringMatching(/^TRUSTED_PROXY_COUNT is not set: .* or to 0 to state that there is none/)]);
  });

  it("refuses the local fakes", () => {
    expect(findProductionConfigProblems({ ...good, SAGLINE_FAKES: "1" })).toEqual([expect.stringContaining("SAGLINE_FAKES=1")]);
  });

  it.each(["1", "0"])("refuses the fault-drill hook SAGLINE_DRILL_EXIT_AFTER_COMMIT=%s, set at all", (value) => {
    expect(findProductionConfigProblems({ ...good, SAGLINE_DRILL_EXIT_AFTER_COMMIT: value })).toEqual([expect.stringMatching(/^SAGLINE_DRILL_EXIT_AFTER_COMMIT is a fault-drill hook/)]);
  });

  it.each(["127.0.0.1:3792", "localhost", "[::1]:8080", "hooks.partner.example, 127.0.0.1", "::1"])("refuses the loopback allowlist %s", (allowlist) => {
    expect(findProductionConfigProblems({ ...good, WEBHOOK_ALLOWLIST: allowlist })).toEqual([expect.stringMatching(/^WEBHOOK_ALLOWLIST lets webhooks reach this machine/)]);
  });

  it.each([undefined, "", "  ", "127.0.0.1", "localhost"])("refuses SMTP_HOST=%s", (smtpHost) => {
    expect(findProductionConfigProblems({ ...good, SMTP_HOST: smtpHost })).toEqual([expect.stringMatching(/^SMTP_HOST/)]);
  });

  it("lists every problem at once", () => {
    expect(findProductionConfigProblems({ SAGLINE_FAKES: "1", WEBHOOK_ALLOWLIST: "127.0.0.1:3792" })).toHaveLength(4);
  });
});
