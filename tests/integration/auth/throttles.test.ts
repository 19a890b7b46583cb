// Throttles of the account doors other than sign-in: reset requests, new-password submissions and
// invitation acceptance, each counted in Redis before any work; and hashing only for a valid link.
import { describe, expect, it, vi } from "vitest";

import { getDb } from "@/db/client";
import { passwordResets } from "@/db/schema";
import { requestPasswordReset, resetPassword } from "@/lib/server/auth/password-reset";
import { hashPassword } from "@/lib/server/auth/passwords";
import { createId, createSecretToken, hashToken } from "@/lib/server/ids";
import { acceptInvitation } from "@/lib/server/people/accept-invitation";
import { createTestMember } from "@/tests/helpers/people";

// The real hash, watched: the test asserts when it runs, not what it returns.
vi.mock("@/lib/server/auth/passwords", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/server/auth/passwords")>();
  return { ...actual, hashPassword: vi.fn(actual.hashPassword) };
});

/** A client address of its own per call (the counter is keyed by any string), so tests never share a counter. */
function freshAddress(): string {
  return `203.0.113.${Math.floor(Math.random() * 254) + 1}-${createId("t")}`;
}

describe("password reset requests", () => {
  it("allow three per address an hour, then answer 429 alike for known and unknown addresses", async () => {
    const member = await createTestMember("viewer");
    const unknown = `nobody-${member.id}@test.example`;
    for (const email of [member.email, unknown]) {
      for (let i = 0; i < 3; i += 1) await expect(requestPasswordReset(email, freshAddress())).resolves.toBeUndefined();
    }
    const known = await requestPasswordReset(member.email, freshAddress()).catch((e: unknown) => e);
    const ghost = await requestPasswordReset(unknown, freshAddress()).catch((e: unknown) => e);
    expect(known).toMatchObject({ code: "rate_limited" });
    // Retry-After may differ by the second between the two counters; the answer's words may not.
    expect({ code: (ghost as { code: string }).code, message: (ghost as Error).message }).toEqual({ code: "rate_limited", message: (known as Error).message });
  });

  it("allow twenty per client address an hour over every e-mail address", async () => {
    const address = freshAddress();
    for (let i = 0; i < 20; i += 1) await requestPasswordReset(`spray-${i}-${createId("x")}@test.example`, address);
    await expect(requestPasswordReset(`spray-last-${createId("x")}@test.example`, address)).rejects.toMatchObject({ code: "rate_limited" });
  });
});

describe("choosing a new password", () => {
  it("hashes the password only for a link that checks out", async () => {
    const member = await createTestMember("viewer");
    const token = createSecretToken();
    await getDb().insert(passwordResets).values({ id: createId("rst"), userId: member.id, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + 60_000) });
    const hashed = vi.mocked(hashPassword);
    hashed.mockClear();
    for (let i = 0; i < 3; i += 1) {
      await expect(resetPassword(createSecretToken(), "a-brand-new-passphrase", freshAddress())).rejects.toMatchObject({ code: "not_found" });
    }
    expect(hashed).not.toHaveBeenCalled();
    await resetPassword(token, "a-brand-new-passphrase", freshAddress());
    expect(hashed).toHaveBeenCalledTimes(1);
  });

  it("allows twenty submissions per client address in fifteen minutes", async () => {
    const address = freshAddress();
    for (let i = 0; i < 20; i += 1) await expect(resetPassword(createSecretToken(), "a-brand-new-passphrase", address)).rejects.toMatchObject({ code: "not_found" });
    await expect(resetPassword(createSecretToken(), "a-brand-new-passphrase", address)).rejects.toMatchObject({ code: "rate_limited" });
  });
});

describe("accepting an invitation", () => {
  it("allows five attempts per link in fifteen minutes, from any address", async () => {
    const token = createSecretToken();
    for (let i = 0; i < 5; i += 1) {
      await expect(acceptInvitation({ token, password: "some-guess-password", clientAddress: freshAddress() })).rejects.toMatchObject({ code: "not_found" });
    }
    const refused = await acceptInvitation({ token, password: "some-guess-password", clientAddress: freshAddress() }).catch((e: unknown) => e);
    expect(refused).toMatchObject({ code: "rate_limited" });
    expect((refused as { retryAfterSeconds: number }).retryAfterSeconds).toBeGreaterThan(0);
  });

  it("allows twenty attempts per client address over every link", async () => {
    const address = freshAddress();
    for (let i = 0; i < 20; i += 1) await acceptInvitation({ token: createSecretToken(), password: "x-guess-password", clientAddress: address }).catch(() => undefined);
    await expect(acceptInvitation({ token: createSecretToken(), password: "x-guess-password", clientAddress: address })).rejects.toMatchObject({ code: "rate_limited" });
  });
});
