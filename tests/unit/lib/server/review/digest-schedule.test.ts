import { describe, expect, it } from "vitest";

import { buildReviewDigestMail } from "@/lib/server/review/digest-mail";
import { getDailyDigestMoment } from "@/lib/server/review/send-review-digests";
import { SAFETY_CAUTION } from "@/lib/safety";

describe("getDailyDigestMoment", () => {
  it("is today's hour once it has passed, otherwise yesterday's", () => {
    expect(getDailyDigestMoment(new Date("2026-03-10T09:30:00Z"), 7).toISOString()).toBe("2026-03-10T07:00:00.000Z");
    expect(getDailyDigestMoment(new Date("2026-03-10T06:59:59Z"), 7).toISOString()).toBe("2026-03-09T07:00:00.000Z");
    expect(getDailyDigestMoment(new Date("2026-03-01T00:10:00Z"), 7).toISOString()).toBe("2026-02-28T07:00:00.000Z");
  });
});

describe("buildReviewDigestMail", () => {
  it("lists each schedule with its counts and link, escapes names in HTML, and carries the caution", () => {
    const mail = buildReviewDigestMail({
      to: "engineer@fernhollow.example",
      organizationName: "Invented <Firm>",
      appUrl: "https://sagline.example",
      frequency: "immediate",
      schedules: [{ id: "sch_a1", name: "<b>Hall B</b>", reference: "R-1", failCount: 2, errorCount: 1, completedAt: new Date("2026-03-10T09:30:00Z") }],
    });
    expect(mail.subject).toBe("Sagline review digest: 1 schedule with 3 members to review");
    expect(mail.text).toContain("- <b>Hall B</b> (R-1): 2 failed, 1 could not be checked; completed 2026-03-10 09:30 UTC");
    expect(mail.text).toContain("https://sagline.example/review?scheduleId=sch_a1");
    expect(mail.text).toContain(SAFETY_CAUTION);
    expect(mail.html).not.toContain("<b>Hall B</b>");
    expect(mail.html).toContain("&#60;b&#62;Hall B");
  });
});
