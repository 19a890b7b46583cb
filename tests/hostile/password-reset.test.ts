// The reset request gives nothing away: the same answer for known and unknown addresses, the mail
// comes from the worker afterwards, and the throttle answers alike too.
import { describe, expect, it } from "vitest";

import { anonymous, findAction, type Agent } from "@/tests/helpers/app";
import { waitForMail } from "@/tests/helpers/mail";
import { createTestMember } from "@/tests/helpers/people";
import { nextTestAddress } from "@/tests/helpers/sign-in";

/** Calls the reset action from a chosen client address; returns the raw answer. */
async function requestReset(agent: Agent, email: string, forwardedFor: string) {
  const action = findAction("(auth)/requestPasswordReset");
  const response = await agent
    .post(action.pagePath)
    .set("Next-Action", action.id)
    .set("Accept", "text/x-component")
    .set("Content-Type", "text/plain;charset=UTF-8")
    .set("Origin", process.env.APP_URL ?? "http://127.0.0.1:3793")
    .set("X-Forwarded-For", forwardedFor)
    .send(JSON.stringify([null, { email }]));
  return { status: response.status, contentType: response.headers["content-type"], body: response.text };
}

describe("the reset request", () => {
  it("answers byte for byte the same for a known and an unknown address; only the known one gets mail", async () => {
    const member = await createTestMember("viewer");
    const unknown = `nobody-${member.id}@test.example`;
    const known = await requestReset(anonymous(), member.email, nextTestAddress());
    const ghost = await requestReset(anonymous(), unknown, nextTestAddress());
    expect(known.status).toBe(200);
    expect(known.body).toContain("a reset link is on its way");
    expect(ghost).toEqual(known);
    await waitForMail(member.email, "Reset your Sagline password");
  });

  it("throttles known and unknown addresses alike, with the same answer", async () => {
    const member = await createTestMember("viewer");
    const unknown = `nobody-${member.id}@test.example`;
    const answers: Record<string, Awaited<ReturnType<typeof requestReset>>> = {};
    for (const email of [member.email, unknown]) {
      for (let i = 0; i < 3; i += 1) await requestReset(anonymous(), email, nextTestAddress());
      answers[email] = await requestReset(anonymous(), email, nextTestAddress());
    }
    expect(answers[member.email]!.body).toContain("Too many reset requests.");
    expect(answers[unknown]).toEqual(answers[member.email]);
  });
});
