import { describe, expect, it } from "vitest";

import { anonymous, APP_URL, signIn } from "@/tests/helpers/app";
import { createTestMember } from "@/tests/helpers/people";

describe("sign-in", () => {
  it("gives an unknown e-mail and a wrong password exactly the same answer", async () => {
    const member = await createTestMember("viewer");
    const wrong = await signIn(member.email, "not-the-password-at-all");
    const unknown = await signIn(`nobody-${member.id}@test.example`, "not-the-password-at-all");
    expect(wrong.error).toBe("invalid");
    expect(unknown).toMatchObject({ status: wrong.status, error: wrong.error });
  });

  it("signs in with the right password, case-insensitive e-mail", async () => {
    const member = await createTestMember("viewer");
    const result = await signIn(member.email.toUpperCase(), member.password);
    expect(result.error).toBeNull();
    const session = await result.agent.get("/api/auth/session");
    expect(session.body).toMatchObject({ uid: member.id });
  });

  it("locks an account after five failures, even for the right password, and unknown accounts alike", async () => {
    const member = await createTestMember("viewer");
    for (let i = 0; i < 5; i += 1) expect((await signIn(member.email, `wrong-${i}-password`)).error).toBe("invalid");
    expect((await signIn(member.email, member.password)).error).toBe("locked");

    const ghost = `ghost-${member.id}@test.example`;
    for (let i = 0; i < 5; i += 1) await signIn(ghost, `wrong-${i}-password`);
    expect((await signIn(ghost, "anything-at-all-here")).error).toBe("locked");
  });

  it.each([
    ["an empty password", { email: "a@example.com", password: "" }],
    ["a malformed e-mail", { email: "not an e-mail <script>", password: "whatever-password" }],
    ["a 300-character password", { email: "a@example.com", password: "p".repeat(300) }],
  ])("refuses %s with the usual answer, not an error", async (_label, credentials) => {
    const result = await signIn(credentials.email, credentials.password);
    expect(result.status).toBeLessThan(500);
    expect(result.error).toBe("invalid");
  });

  it("refuses a 10 MB password with 413 problem+json before reading it", async () => {
    const agent = anonymous();
    const csrf = await agent.get("/api/auth/csrf");
    const response = await agent
      .post("/api/auth/callback/credentials")
      .set("Origin", APP_URL)
      .type("form")
      .send({ csrfToken: csrf.body.csrfToken, email: "a@example.com", password: "p".repeat(10 * 1024 * 1024) });
    expect(response.status).toBe(413);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/too-large", status: 413 });
  });
});
