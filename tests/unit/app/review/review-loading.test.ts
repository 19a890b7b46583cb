// /review shows a loading state while the queue is read: announced politely, not blank.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";

import ReviewLoading from "@/app/(dashboard)/review/loading";

describe("the review queue's loading state", () => {
  it("is a polite status naming what is being loaded", () => {
    const html = renderToStaticMarkup(createElement(ReviewLoading));
    expect(html).toContain('role="status"');
    expect(html).toContain('aria-live="polite"');
    expect(html).toContain("Loading the review queue");
  });
});
