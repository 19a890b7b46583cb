import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { invitations } from "@/db/schema";
import { hashToken } from "@/lib/server/ids";
import { anonymous, callAction, findAction, signIn, signInAs } from "@/tests/helpers/app";
import { extractLink, waitForMail } from "@/tests/helpers/mail";

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

async function inviteByAdmin(email: string, role = "engineer") {
  const admin = await signInAs("admin");
  const { result } = await callAction(admin, findAction("people/inviteMember"), { email, role });
  expect(result).toMatchObject({ ok: true });
  const mail = await waitForMail(email, "invited");
  return extractLink(mail, "/invitations/");
}

describe("invitations", () => {
  it("sends HTML and text mail whose single-use link makes a working account", async () => {
    const email = `new-${unique()}@test.example`;
    const link = await inviteByAdmin(email);
    const mail = await waitForMail(email, "invited");
    expect(mail.html).toContain(link);
    expect(mail.text).toContain("expires in 72 hours");

    const token = link.split("/").at(-1)!;
    const page = await anonymous().get(`/invitations/${token}`);
    expect(page.status).toBe(200);
    expect(page.text.replaceAll("<!-- -->", "")).toContain("Join Fernhollow Vantarra Engineers");

    const accept = findAction("(auth)/acceptInvitation");
    const name = `<script>alert("x")</script> Zhou Ngata`;
    const first = await callAction(anonymous(), accept, { token, name, password: "a-good-long-passphrase", accountExists: "no" });
    expect(first.redirect).toContain("/sign-in?notice=invitation-accepted");

    const { agent, error } = await signIn(email, "a-good-long-passphrase");
    expect(error).toBeNull();
    const schedules = await agent.get("/schedules");
    expect(schedules.status).toBe(200);
    // Hostile text in a name renders as text.
    expect(schedules.text).toContain("&lt;script&gt;");
    expect(schedules.text).not.toContain('<script>alert("x")</script>');

    const again = await callAction(anonymous(), accept, { token, name: "Someone Else", password: "another-long-passphrase", accountExists: "no" });
    expect(again.result).toMatchObject({ ok: false, code: "not_found" });
    expect((await anonymous().get(`/invitations/${token}`)).text).toContain("This invitation no longer works");
  });

  it("refuses an expired invitation with a clear message", async () => {
    const email = `late-${unique()}@test.example`;
    const token = (await inviteByAdmin(email)).split("/").at(-1)!;
    await getDb().update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(sql`${invitations.tokenHash} = ${hashToken(token)}`);
    const { result } = await callAction(anonymous(), findAction("(auth)/acceptInvitation"), { token, name: "Late Comer", password: "a-good-long-passphrase", accountExists: "no" });
    expect(result).toMatchObject({ ok: false, code: "not_found" });
    expect(result?.message).toMatch(/expired, was already used or was withdrawn/);
  });

  it.each([
    ["a malformed e-mail", { email: "not-an-email", role: "viewer" }, "email", "Enter a valid e-mail address, like name@example.com."],
    ["an empty e-mail", { email: "", role: "viewer" }, "email", "Enter an e-mail address."],
    ["an unknown role", { email: "ok@test.example", role: "superuser" }, "role", "Choose one of the roles."],
  ])("refuses %s naming the field", async (_label, input, field, message) => {
    const admin = await signInAs("admin");
    const { status, result } = await callAction(admin, findAction("people/inviteMember"), input);
    expect(status).toBe(200);
    expect(result).toMatchObject({ ok: false, code: "invalid_input" });
    expect(result?.fieldErrors?.[field]).toBe(message);
  });

  it("refuses a weak password and a 10 MB password on acceptance without a 500", async () => {
    const email = `weak-${unique()}@test.example`;
    const token = (await inviteByAdmin(email)).split("/").at(-1)!;
    const accept = findAction("(auth)/acceptInvitation");
    const weak = await callAction(anonymous(), accept, { token, name: "Weak", password: "short", accountExists: "no" });
    expect(weak.result?.fieldErrors?.password).toBe("Use at least 12 characters.");
    const huge = await callAction(anonymous(), accept, { token, name: "Huge", password: "p".repeat(10 * 1024 * 1024), accountExists: "no" });
    expect(huge.status).toBe(413);
    expect(huge.body).toContain("https://sagline.dev/problems/too-large");
    // Nothing was half-written: the invitation is still open.
    expect((await anonymous().get(`/invitations/${token}`)).text).toContain("Join ");
  });
});
