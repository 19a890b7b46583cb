import { Webhook as IndependentVerifier } from "standardwebhooks";
import { describe, expect, it } from "vitest";

import { createSigningSecret, listSigningSecrets, signDelivery } from "@/lib/server/webhooks/sign";

const body = JSON.stringify({ type: "webhook.test", timestamp: "2026-12-01T12:00:00.000Z", data: { endpointId: "wh_abc", message: "hi" } });

function verifyWith(secret: string, headers: Record<string, string>, payload = body) {
  return new IndependentVerifier(secret).verify(payload, headers);
}

describe("Standard Webhooks signing", () => {
  it("issues whsec_ secrets of 32 random bytes (the scheme allows 24 to 64)", () => {
    const secret = createSigningSecret();
    expect(secret).toMatch(/^whsec_[A-Za-z0-9+/]+=*$/);
    expect(Buffer.from(secret.slice(6), "base64")).toHaveLength(32);
    expect(createSigningSecret()).not.toBe(secret);
  });

  it("signs id.timestamp.body so the independent verifier accepts it, and rejects tampering", () => {
    const secret = createSigningSecret();
    const headers = signDelivery({ messageId: "evt_123", at: new Date(), body, secrets: [secret] });
    expect(headers["webhook-id"]).toBe("evt_123");
    expect(headers["webhook-signature"]).toMatch(/^v1,[A-Za-z0-9+/]+=*$/);
    expect(verifyWith(secret, { ...headers })).toMatchObject({ type: "webhook.test" });
    expect(() => verifyWith(secret, { ...headers }, body.replace("hi", "ho"))).toThrow();
    expect(() => verifyWith(createSigningSecret(), { ...headers })).toThrow();
    expect(() => verifyWith(secret, { ...headers, "webhook-id": "evt_124" })).toThrow();
  });

  it("sends the timestamp in Unix seconds; receivers reject one beyond 5 minutes (Standard Webhooks)", () => {
    const secret = createSigningSecret();
    const at = new Date(Date.now() - 6 * 60_000);
    const headers = signDelivery({ messageId: "evt_old", at, body, secrets: [secret] });
    expect(headers["webhook-timestamp"]).toBe(String(Math.floor(at.getTime() / 1000)));
    expect(() => verifyWith(secret, { ...headers })).toThrow(/timestamp/i);
  });

  it("sends two signatures during a rotation, each verifying with its own secret", () => {
    const oldSecret = createSigningSecret();
    const newSecret = createSigningSecret();
    const now = new Date();
    const endpoint = { secret: newSecret, previousSecret: oldSecret, previousSecretExpiresAt: new Date(now.getTime() + 3_600_000) };
    const secrets = listSigningSecrets(endpoint, now);
    expect(secrets).toEqual([oldSecret, newSecret]);
    const headers = signDelivery({ messageId: "evt_rot", at: now, body, secrets });
    expect(headers["webhook-signature"].split(" ")).toHaveLength(2);
    expect(verifyWith(oldSecret, { ...headers })).toBeTruthy();
    expect(verifyWith(newSecret, { ...headers })).toBeTruthy();

    const after = new Date(now.getTime() + 3_600_001);
    expect(listSigningSecrets(endpoint, after)).toEqual([newSecret]);
    // Signed at `now` (inside the verifier's 5-minute window) but with the secrets chosen after
    // expiry, so only the missing old signature can make the old secret fail.
    const later = signDelivery({ messageId: "evt_rot", at: now, body, secrets: listSigningSecrets(endpoint, after) });
    expect(() => verifyWith(oldSecret, { ...later })).toThrow();
    expect(verifyWith(newSecret, { ...later })).toBeTruthy();
  });
});
