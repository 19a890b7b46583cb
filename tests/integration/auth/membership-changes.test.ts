// A role change or a removal applies on the user's next request, not when the token expires.
import { describe, expect, it } from "vitest";

import { changeMemberRole, removeMember } from "@/lib/server/people/manage-members";
import { demoOrganizations } from "@/db/seed-data";
import { signIn } from "@/tests/helpers/app";
import { createTestMember } from "@/tests/helpers/people";

const organizationId = demoOrganizations.engineering.id;

describe("membership changes", () => {
  it("a promotion opens the people page on the very next request", async () => {
    const member = await createTestMember("viewer");
    const { agent } = await signIn(member.email, member.password);
    expect((await agent.get("/people").redirects(0)).status).toBe(403);
    await changeMemberRole({ organizationId, membershipId: member.membershipId, role: "admin" });
    expect((await agent.get("/people").redirects(0)).status).toBe(200);
    await changeMemberRole({ organizationId, membershipId: member.membershipId, role: "submitter" });
    expect((await agent.get("/people").redirects(0)).status).toBe(403);
  });

  it("a removal closes every area on the very next request", async () => {
    const member = await createTestMember("engineer");
    const { agent } = await signIn(member.email, member.password);
    expect((await agent.get("/schedules").redirects(0)).status).toBe(200);
    await removeMember({ organizationId, membershipId: member.membershipId, creatorKeys: "revoke" });
    expect((await agent.get("/schedules").redirects(0)).status).toBe(403);
  });

  it("keeps at least one administrator", async () => {
    const { memberships } = await import("@/db/schema");
    const { getDb } = await import("@/db/client");
    const { and, eq } = await import("drizzle-orm");
    const [admin] = await getDb()
      .select()
      .from(memberships)
      .where(and(eq(memberships.organizationId, demoOrganizations.fabricator.id), eq(memberships.role, "admin")));
    await expect(changeMemberRole({ organizationId: demoOrganizations.fabricator.id, membershipId: admin!.id, role: "viewer" })).rejects.toMatchObject({ code: "conflict" });
    await expect(removeMember({ organizationId: demoOrganizations.fabricator.id, membershipId: admin!.id, creatorKeys: "keep" })).rejects.toMatchObject({ code: "conflict" });
  });

  it("treats another organization's membership exactly like a missing one", async () => {
    const member = await createTestMember("viewer", demoOrganizations.fabricator.id);
    await expect(changeMemberRole({ organizationId, membershipId: member.membershipId, role: "admin" })).rejects.toMatchObject({ code: "not_found" });
    await expect(changeMemberRole({ organizationId, membershipId: "mem_doesnotexist", role: "admin" })).rejects.toMatchObject({ code: "not_found" });
  });
});
