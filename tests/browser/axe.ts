import AxeBuilder from "@axe-core/playwright";
import { expect, type Page } from "@playwright/test";

/**
 * Runs axe-core (WCAG 2.0 and 2.1, levels A and AA) on the page through @axe-core/playwright, and fails
 * on any serious or critical violation. It injects axe through the browser's debugging protocol, which
 * the page's content security policy does not govern.
 */
export async function expectNoSeriousA11yViolations(page: Page, label: string): Promise<void> {
  const { violations } = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  const serious = violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  const report = serious.map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
  expect(report, `${label}: serious or critical accessibility violations`).toEqual([]);
}
