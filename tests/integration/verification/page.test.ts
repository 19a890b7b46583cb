// The /verification page over HTTP: every registered group (lib/verification/index.ts) renders
// with its title, each case beside its source, with the safety caution.
import { beforeAll, describe, expect, it } from "vitest";

import { SAFETY_CAUTION } from "@/lib/safety";
import { VERIFICATION_GROUPS } from "@/lib/verification";
import { signInAs, type Agent } from "@/tests/helpers/app";

let viewer: Agent;
beforeAll(async () => {
  viewer = await signInAs("viewer");
});

describe("the verification page", () => {
  it("renders every registered group and case, all within tolerance, with the caution", async () => {
    const response = await viewer.get("/verification");
    expect(response.status).toBe(200);
    const html = response.text.replaceAll("&#x27;", "'").replaceAll("&amp;", "&");
    for (const group of VERIFICATION_GROUPS) {
      expect(html).toContain(group.title);
      for (const c of group.cases) expect(html).toContain(c.source);
    }
    expect(html).toContain("EN 1993-1-1:2005 6.2.6(3)(f)");
    expect(html).toContain(SAFETY_CAUTION);
    expect(html).not.toContain("✗ beyond");
  });
});
