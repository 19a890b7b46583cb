// Guessing passwords: parallel guesses cannot beat the per-account limit, one client address
// cannot spray every account, an unknown account and a wrong password get the same answer, and
// no callbackUrl sends a signed-in person to another site.
import { describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { createTestMember } from "@/tests/helpers/people";
import { nextTestAddress, signInFrom } from "@/tests/helpers/sign-in";

const MAX_FAILURES = Number(process.env.SIGN_IN_MAX_FAILURES ?? 5);
const MAX_PER_ADDRESS = Number(process.env.SIGN_IN_MAX_PER_ADDRESS ?? 50);

describe("the sign-in race", () => {
  it("200 parallel wrong guesses from 200 addresses: no more than the limit reach the password check", async () => {
    const member = await createTestMember("viewer");
    const answers = await Promise.all(
      Array.from({ length: 200 }, (_, i) => signInFrom({ email: member.email, password: `wrong-guess-${i}-pw`, forwardedFor: nextTestAddress() })),
    );
    const checked = answers.filter((a) => a.error === "invalid").length;
    const locked = answers.filter((a) => a.error === "locked").length;
    expect({ checked, locked }).toEqual({ checked: MAX_FAILURES, locked: 200 - MAX_FAILURES });
    // The right password is refused while the lock lasts.
    expect((await signInFrom({ email: member.email, password: member.password, forwardedFor: nextTestAddress() })).error).toBe("locked");
  });

  it("once the limit is used up, the right password among parallel attempts is not checked either", async () => {
    const member = await createTestMember("viewer");
    for (let i = 0; i < MAX_FAILURES; i += 1) await signInFrom({ email: member.email, password: `wrong-guess-${i}-pw`, forwardedFor: nextTestAddress() });
    const guesses = Array.from({ length: 20 }, (_, i) => (i === 10 ? member.password : `late-guess-${i}-pw`));
    const answers = await Promise.all(guesses.map((password) => signInFrom({ email: member.email, password, forwardedFor: nextTestAddress() })));
    expect(answers.map((a) => a.error)).toEqual(guesses.map(() => "locked"));
  });

  it("one client address is throttled over every account after its limit", async () => {
    const address = nextTestAddress();
    const answers = await Promise.all(
      Array.from({ length: MAX_PER_ADDRESS + 15 }, (_, i) => signInFrom({ email: `spray-${i}-${Date.now()}@test.example`, password: "common-password-1", forwardedFor: address })),
    );
    const throttled = answers.filter((a) => a.error === "throttled").length;
    expect(throttled).toBe(15);
    expect(answers.filter((a) => a.error === "invalid").length).toBe(MAX_PER_ADDRESS);
  });
});

describe("unknown account and wrong password", () => {
  it("get identical answers: status, body, content type and cookies", async () => {
    const member = await createTestMember("viewer");
    const wrong = await signInFrom({ email: member.email, password: "not-the-password-at-all", forwardedFor: nextTestAddress() });
    const unknown = await signInFrom({ email: `nobody-${member.id}@test.example`, password: "not-the-password-at-all", forwardedFor: nextTestAddress() });
    expect(wrong.error).toBe("invalid");
    expect(unknown).toEqual(wrong);
  });

  it("get identical answers once locked", async () => {
    const member = await createTestMember("viewer");
    const ghost = `ghost-${member.id}@test.example`;
    for (const email of [member.email, ghost]) {
      for (let i = 0; i <= MAX_FAILURES; i += 1) await signInFrom({ email, password: `wrong-${i}-password`, forwardedFor: nextTestAddress() });
    }
    const known = await signInFrom({ email: member.email, password: "another-wrong-one", forwardedFor: nextTestAddress() });
    const unknown = await signInFrom({ email: ghost, password: "another-wrong-one", forwardedFor: nextTestAddress() });
    expect(known.error).toBe("locked");
    expect(unknown).toEqual(known);
  });
});

const redirectCorpus = [
  "/\\evil.example",
  "/%5Cevil.example",
  "/%09/evil.example",
  "/\t/evil.example",
  "/\\t/evil",
  "//evil.example",
  "%2F%2Fevil.example",
  "/%2F%2Fevil.example",
  "///evil.example",
  "https://evil.example",
  "https://evil.example/schedules",
  `${APP_URL}.evil.example/`,
  `${APP_URL}@evil.example/`,
  "javascript:alert(document.domain)",
  "data:text/html,<script>alert(1)</script>",
];

describe("the open-redirect corpus", () => {
  it.each(redirectCorpus)("sign-in with callbackUrl %j lands on this app", async (callbackUrl) => {
    const member = await createTestMember("viewer");
    const answer = await signInFrom({ email: member.email, password: member.password, forwardedFor: nextTestAddress(), callbackUrl });
    expect(answer.error).toBeNull();
    const landing = new URL(answer.url!);
    expect(landing.origin).toBe(new URL(APP_URL).origin);
    expect(landing.pathname).toBe("/schedules");
  });

  it.each(redirectCorpus)("the sign-in page drops callbackUrl %j", async (callbackUrl) => {
    const response = await fetch(`${APP_URL}/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}`);
    expect(response.status).toBe(200);
    // The form's callbackUrl prop, as serialised into the page's flight data.
    const props = [...(await response.text()).matchAll(/callbackUrl\\?":\\?"([^"\\]*)/g)].map((m) => m[1]);
    expect(props.length).toBeGreaterThan(0);
    expect(new Set(props)).toEqual(new Set(["/schedules"]));
  });

  it("keeps a path of this app", async () => {
    const member = await createTestMember("viewer");
    const answer = await signInFrom({ email: member.email, password: member.password, forwardedFor: nextTestAddress(), callbackUrl: "/review?status=open" });
    expect(new URL(answer.url!).pathname + new URL(answer.url!).search).toBe("/review?status=open");
  });
});
