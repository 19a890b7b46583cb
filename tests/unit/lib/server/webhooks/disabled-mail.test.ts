import { describe, expect, it } from "vitest";

import { buildEndpointDisabledMail } from "@/lib/server/webhooks/notify-disabled";

const base = { to: "priya@ostrovel.example", organizationName: "Ostrovel Steel & Timber Works", url: "https://erp.ostrovel.example/hooks?a=<b>", consoleUrl: "http://127.0.0.1:3790/integrations/webhooks" };

describe("the endpoint-disabled e-mail", () => {
  it("says which endpoint, why, what the last answer was and where to fix it", () => {
    const mail = buildEndpointDisabledMail({ ...base, reason: "failing", lastStatusCode: 503, lastError: null });
    expect(mail.subject).toBe("Webhook endpoint disabled for Ostrovel Steel & Timber Works");
    expect(mail.text).toContain("Sagline stopped sending events to https://erp.ostrovel.example/hooks?a=<b>.");
    expect(mail.text).toContain("Every attempt of the published retry schedule failed.");
    expect(mail.text).toContain("HTTP 503");
    expect(mail.text).toContain(base.consoleUrl);
  });

  it("names a network error when there was no answer, and 410 Gone for a gone endpoint", () => {
    expect(buildEndpointDisabledMail({ ...base, reason: "failing", lastStatusCode: null, lastError: "connection refused" }).text).toContain("The last attempt failed: connection refused.");
    expect(buildEndpointDisabledMail({ ...base, reason: "gone", lastStatusCode: 410, lastError: null }).text).toContain("410 Gone");
  });

  it("escapes the URL and the organization name in the HTML part", () => {
    const mail = buildEndpointDisabledMail({ ...base, reason: "gone", lastStatusCode: 410, lastError: null });
    expect(mail.html).toContain("a=&#60;b&#62;");
    expect(mail.html).toContain("Steel &#38; Timber");
    expect(mail.html).not.toContain("<b>");
  });
});
