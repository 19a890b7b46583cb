// Secret rotation (both signatures during the overlap, only the new one after) and the SSRF guard
// at connection time (a name that resolves to a private address when the attempt is made).
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { webhookEndpoints } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";
import { attemptDelivery } from "@/lib/server/webhooks/deliver";
import { createEndpoint, revealEndpointSecret, rotateEndpointSecret } from "@/lib/server/webhooks/endpoints";

import { createTestOrganization, insertDelivery, insertEndpoint, startReceiver, verifyWith } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
beforeAll(async () => {
  org = await createTestOrganization("rotation");
});
afterAll(async () => {
  await org.remove();
});

describe("secret rotation", () => {
  it("signs with the old and the new secret during the overlap, then only with the new", async () => {
    const receiver = await startReceiver();
    const deps = { config: { allowlist: [`127.0.0.1:${receiver.port}`], retryScale: 0.001, timeoutMs: 1_000 } };
    const endpoint = await insertEndpoint(org.organizationId, receiver.url);
    const oldSecret = endpoint.secret;
    const { secret: newSecret, previousSecretExpiresAt } = await rotateEndpointSecret({ organizationId: org.organizationId, endpointId: endpoint.id, overlapMs: 3_600_000 });
    expect(newSecret).not.toBe(oldSecret);
    expect(previousSecretExpiresAt.getTime()).toBeGreaterThan(Date.now() + 3_500_000);
    expect(await revealEndpointSecret({ organizationId: org.organizationId, endpointId: endpoint.id })).toMatchObject({ secret: newSecret, previousSecret: oldSecret });

    const during = await insertDelivery(org.organizationId, endpoint.id);
    expect((await attemptDelivery({ deliveryId: during.deliveryId, attemptNumber: 1 }, deps)).kind).toBe("succeeded");
    const duringRequest = receiver.received.at(-1)!;
    expect(String(duringRequest.headers["webhook-signature"]).split(" ")).toHaveLength(2);
    expect(verifyWith(oldSecret, duringRequest)).toBeTruthy();
    expect(verifyWith(newSecret, duringRequest)).toBeTruthy();

    // The overlap ends.
    await getDb().update(webhookEndpoints).set({ previousSecretExpiresAt: new Date(Date.now() - 1_000) }).where(eq(webhookEndpoints.id, endpoint.id));
    const after = await insertDelivery(org.organizationId, endpoint.id);
    expect((await attemptDelivery({ deliveryId: after.deliveryId, attemptNumber: 1 }, deps)).kind).toBe("succeeded");
    const afterRequest = receiver.received.at(-1)!;
    expect(String(afterRequest.headers["webhook-signature"]).split(" ")).toHaveLength(1);
    expect(verifyWith(newSecret, afterRequest)).toBeTruthy();
    expect(() => verifyWith(oldSecret, afterRequest)).toThrow();
    expect(await revealEndpointSecret({ organizationId: org.organizationId, endpointId: endpoint.id })).toMatchObject({ secret: newSecret, previousSecret: null });
    await receiver.close();
  });
});

describe("the SSRF guard at connection time", () => {
  it("refuses when the name resolves to a private address at attempt time (DNS rebinding), sending nothing", async () => {
    // Registration saw a public address (on port 80: other ports need host:port in the allowlist)...
    const endpoint = await createEndpoint(
      { organizationId: org.organizationId, url: "http://rebind.partner.example/hook", eventTypes: ["schedule.completed"] },
      async () => ["93.184.215.14"],
    );
    const { deliveryId } = await insertDelivery(org.organizationId, endpoint.id);
    // ...the attempt sees loopback: refused before any connection (a connection would fail differently).
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, { config: { allowlist: [], retryScale: 0.001 }, resolve: async () => ["127.0.0.1"] });
    expect(outcome).toMatchObject({ kind: "retry", statusCode: null, error: expect.stringContaining("refused by the SSRF guard") });
    expect(outcome.kind === "retry" && outcome.error).toContain("127.0.0.1");
  });

  it("refuses at registration a name resolving to a private address, naming the url field", async () => {
    const attempt = createEndpoint({ organizationId: org.organizationId, url: "https://intranet.partner.example/hook", eventTypes: ["schedule.completed"] }, async () => ["10.20.30.40"]);
    await expect(attempt).rejects.toBeInstanceOf(DomainError);
    await expect(attempt).rejects.toMatchObject({ code: "invalid_input", errors: [{ pointer: "url", message: expect.stringContaining("10.20.30.40") }] });
  });
});
