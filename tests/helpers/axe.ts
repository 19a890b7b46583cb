import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";

/** The impacts that fail a scan: serious and critical (minor and moderate are reported, not failed). */
const FAILING_IMPACTS = new Set(["serious", "critical"]);

export interface AxeFinding {
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

/** Runs axe-core (WCAG 2.0/2.1 A and AA rules) on the page as it is and lists the serious and critical violations. */
export async function findSeriousViolations(page: Page): Promise<AxeFinding[]> {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations
    .filter((v) => FAILING_IMPACTS.has(v.impact ?? ""))
    .map((v) => ({ id: v.id, impact: v.impact ?? "", help: v.help, targets: v.nodes.slice(0, 5).map((n) => n.target.join(" ")) }));
}
