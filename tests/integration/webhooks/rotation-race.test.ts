// Concurrent secret rotations of one endpoint: each hands out the secret it stored.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { webhookEndpoints } from "@/db/schema";
import { rotateEndpointSecret } from "@/lib/server/webhooks/endpoints";

import { createTestOrganization, insertEndpoint } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
beforeAll(async () => {
  org = await createTestOrganization("rotation-race");
});
afterAll(async () => {
  await org.remove();
});

describe("concurrent secret rotations", () => {
  it("form one chain: the stored secret and the one it retired are both secrets that were handed out", async () => {
    const endpoint = await insertEndpoint(org.organizationId, "https://receiver.partner.example/hook");
    const rotations = await Promise.all(
      Array.from({ length: 12 }, () => rotateEndpointSecret({ organizationId: org.organizationId, endpointId: endpoint.id, overlapMs: 3_600_000 })),
    );
    const handedOut = rotations.map((r) => r.secret);
    expect(new Set(handedOut).size).toBe(handedOut.length);
    const [row] = await getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.id, endpoint.id));
    expect(handedOut).toContain(row!.secret);
    // Lost updates would leave the original secret (or a never-stored one) as the previous secret.
    expect(row!.previousSecret).not.toBe(endpoint.secret);
    expect(handedOut).toContain(row!.previousSecret);
  });
});
