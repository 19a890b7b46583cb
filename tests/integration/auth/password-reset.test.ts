import { describe, expect, it } from "vitest";

import { anonymous, callAction, findAction, signIn } from "@/tests/helpers/app";
import { extractLink, waitForMail } from "@/tests/helpers/mail";
import { createTestMember } from "@/tests/helpers/people";

describe("password reset", () => {
  it("answers the same for unknown addresses and mails a single-use link to known ones", async () => {
    const member = await createTestMember("submitter");
    const request = findAction("(auth)/requestPasswordReset");
    const known = await callAction(anonymous(), request, { email: member.email });
    const unknown = await callAction(anonymous(), request, { email: `nobody-${member.id}@test.example` });
    expect(unknown.result).toEqual(known.result);
    expect(known.result).toMatchObject({ ok: true });

    const { agent: oldSession } = await signIn(member.email, member.password);
    expect((await oldSession.get("/schedules").redirects(0)).status).toBe(200);

    const link = extractLink(await waitForMail(member.email, "Reset your Sagline password"), "/reset-password/");
    const token = link.split("/").at(-1)!;
    const reset = findAction("(auth)/resetPassword");
    const mismatch = await callAction(anonymous(), reset, { token, password: "a-brand-new-passphrase", confirm: "something-else-entirely" });
    expect(mismatch.result?.fieldErrors?.confirm).toBe("The two passwords differ.");

    const done = await callAction(anonymous(), reset, { token, password: "a-brand-new-passphrase", confirm: "a-brand-new-passphrase" });
    expect(done.redirect).toContain("/sign-in?notice=password-changed");
    expect((await signIn(member.email, "a-brand-new-passphrase")).error).toBeNull();
    expect((await signIn(member.email, member.password)).error).toBe("invalid");
    // Sessions issued before the change are signed out.
    expect((await oldSession.get("/schedules").redirects(0)).status).toBe(307);

    const reused = await callAction(anonymous(), reset, { token, password: "yet-another-passphrase", confirm: "yet-another-passphrase" });
    expect(reused.result).toMatchObject({ ok: false, code: "not_found" });
    expect((await anonymous().get(`/reset-password/${token}`)).text).toContain("This link no longer works");
  });
});
