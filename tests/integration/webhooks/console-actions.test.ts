// The console's server actions over real HTTP as the browser calls them: registration with the
// SSRF corpus, reveal, rotate, enable/disable, test events, resend, and another organization's ids.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { callAction, findAction, signIn, signInAs, type Agent } from "@/tests/helpers/app";

import { configurePartner, createTestOrganization, PARTNER_URL, readPartner, waitFor } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
let integrator: Agent;
beforeAll(async () => {
  org = await createTestOrganization("console");
  const { agent, error } = await signIn(org.people.integrator.email, org.people.integrator.password);
  if (error) throw new Error(error);
  integrator = agent;
});
afterAll(async () => {
  await org.remove();
});

const act = (agent: Agent, key: string, input: Record<string, unknown>) => callAction(agent, findAction(`webhooks/${key}`), input);
const allEvents = { "event:schedule.completed": "on", "event:schedule.failed": "on" };

async function endpointsOfOrg() {
  return getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.organizationId, org.organizationId));
}

describe("registering an endpoint from the console", () => {
  it.each([
    "http://127.0.0.1/hook",
    "http://2130706433/",
    "http://0x7f.1/",
    "http://017700000001/",
    "http://127.1/",
    "http://[::1]/",
    "http://[::ffff:127.0.0.1]/",
    "http://169.254.169.254/latest/meta-data/",
    "http://[fd00:ec2::254]/",
    "http://metadata.google.internal/",
    "http://localhost/",
    "http://10.0.0.1/",
    "http://192.168.1.1/",
    "http://172.16.5.4/",
    "http://100.64.0.1/",
    "http://0.0.0.0/",
    "ftp://partner.example/",
    // Loopback on a port that is not on the allowlist (npm test allows only the fake partner's).
    "http://127.0.0.1:1/hook",
  ])("refuses %s naming the url field", async (url) => {
    const { status, result } = await act(integrator, "createEndpoint", { url, ...allEvents });
    expect(status).toBe(200);
    expect(result).toMatchObject({ ok: false, code: "invalid_input" });
    expect(result?.fieldErrors?.url).toMatch(/^The URL /);
  });

  it("refuses an endpoint with no events, naming the field", async () => {
    const { result } = await act(integrator, "createEndpoint", { url: `${PARTNER_URL}/hooks/none` });
    expect(result).toMatchObject({ ok: false, code: "invalid_input", fieldErrors: { eventTypes: "Choose at least one event." } });
  });

  it("creates, reveals, tests, rotates, disables and deletes an endpoint", async () => {
    const receiver = `console${Date.now().toString(36)}`;
    const url = `${PARTNER_URL}/hooks/${receiver}`;
    const created = await act(integrator, "createEndpoint", { url, description: "Ostrovel yard receiver <b>", ...allEvents });
    expect(created.result).toMatchObject({ ok: true });
    const [endpoint] = (await endpointsOfOrg()).filter((e) => e.url === url);
    expect(endpoint).toMatchObject({ enabled: true, eventTypes: ["schedule.completed", "schedule.failed"], description: "Ostrovel yard receiver <b>" });
    // Hostile text in a description renders as text.
    const listed = await integrator.get("/integrations/webhooks");
    expect(listed.text).toContain("Ostrovel yard receiver &lt;b&gt;");
    expect(listed.text).not.toContain(endpoint!.secret);

    const revealed = (await act(integrator, "revealSecret", { endpointId: endpoint!.id })).result as unknown as { ok: boolean; data: { secret: string } };
    expect(revealed.data.secret).toBe(endpoint!.secret);
    expect(revealed.data.secret).toMatch(/^whsec_/);
    await configurePartner(receiver, { secrets: [revealed.data.secret] });

    expect((await act(integrator, "sendTestEvent", { endpointId: endpoint!.id })).result).toMatchObject({ ok: true });
    const state = await waitFor("the test event", async () => {
      const s = await readPartner(receiver);
      return s.processed.length ? s : null;
    });
    expect(state.deliveries[0]).toMatchObject({ verified: true, answeredStatus: 200 });
    expect(JSON.parse(state.deliveries[0]!.body)).toMatchObject({ type: "webhook.test", data: { endpointId: endpoint!.id } });

    expect((await act(integrator, "rotateSecret", { endpointId: endpoint!.id })).result?.message).toMatch(/Both secrets sign deliveries until/);
    const [rotated] = (await endpointsOfOrg()).filter((e) => e.id === endpoint!.id);
    expect(rotated!.previousSecret).toBe(endpoint!.secret);
    expect(rotated!.secret).not.toBe(endpoint!.secret);

    expect((await act(integrator, "updateEndpoint", { endpointId: endpoint!.id, url, description: "", "event:member.dispositioned": "on" })).result).toMatchObject({ ok: true });
    expect((await endpointsOfOrg()).find((e) => e.id === endpoint!.id)!.eventTypes).toEqual(["member.dispositioned"]);

    expect((await act(integrator, "setEndpointEnabled", { endpointId: endpoint!.id, enabled: "false" })).result).toMatchObject({ ok: true });
    expect((await endpointsOfOrg()).find((e) => e.id === endpoint!.id)).toMatchObject({ enabled: false, disabledReason: "manual" });
    expect((await act(integrator, "sendTestEvent", { endpointId: endpoint!.id })).result).toMatchObject({ ok: false, code: "conflict" });
    expect((await act(integrator, "setEndpointEnabled", { endpointId: endpoint!.id, enabled: "true" })).result).toMatchObject({ ok: true });

    const [delivery] = await getDb().select().from(webhookDeliveries).where(eq(webhookDeliveries.endpointId, endpoint!.id));
    expect((await act(integrator, "resendDelivery", { deliveryId: delivery!.id })).result).toMatchObject({ ok: true });
    expect((await act(integrator, "resendFailedSince", { since: "2026-01-01T00:00" })).result).toMatchObject({ ok: true });

    const page = await integrator.get("/integrations/webhooks/deliveries");
    expect(page.status).toBe(200);
    expect(page.text).toContain(delivery!.eventId);
    const list = await integrator.get("/integrations/webhooks");
    // The secret is never on the page; only the reveal action returns it.
    expect(list.text).toContain(endpoint!.id);
    expect(list.text).not.toContain(rotated!.secret);

    expect((await act(integrator, "deleteEndpoint", { endpointId: endpoint!.id })).result).toMatchObject({ ok: true });
    expect((await endpointsOfOrg()).find((e) => e.id === endpoint!.id)).toBeUndefined();
  });

  it("answers another organization's endpoint and delivery ids exactly like missing ones", async () => {
    const created = await act(integrator, "createEndpoint", { url: `${PARTNER_URL}/hooks/private${Date.now().toString(36)}`, ...allEvents });
    expect(created.result).toMatchObject({ ok: true });
    const [endpoint] = await endpointsOfOrg();
    const outsider = await signInAs("integrator");
    const missing = "wh_0000000000000000";
    for (const key of ["revealSecret", "rotateSecret", "sendTestEvent", "deleteEndpoint"]) {
      const theirs = await act(outsider, key, { endpointId: endpoint!.id });
      const none = await act(outsider, key, { endpointId: missing });
      expect(theirs.result, key).toMatchObject({ ok: false, code: "not_found" });
      expect(theirs.result, key).toEqual(none.result);
    }
    const page = await outsider.get(`/integrations/webhooks/deliveries?endpoint=${endpoint!.id}`);
    // The delivery log itself answered (not a redirect or an error page), so the absence below means something.
    expect(page.status).toBe(200);
    expect(page.text).toContain("Webhook deliveries");
    expect(page.text).not.toContain(endpoint!.url);
  });
});
