// Accessibility checks the journeys share: axe-core (WCAG 2.x A and AA rules and best
// practices) over the whole page, with no violation of any impact allowed.
import AxeBuilder from "@axe-core/playwright";
import { expect, type Page } from "@playwright/test";

export async function expectNoAxeViolations(page: Page, where = page.url()) {
  // A dynamic page's metadata is streamed after its first HTML: let the title arrive before
  // judging it. A page that never gets one still fails below, on axe's document-title rule.
  await page.waitForFunction(() => document.title.trim() !== "", null, { timeout: 10_000 }).catch(() => undefined);
  const result = await new AxeBuilder({ page }).analyze();
  const found = result.violations.map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).slice(0, 4).join(" | ")}`);
  expect(found, `axe violations on ${where}`).toEqual([]);
}

/** Figures in a metric unit anywhere in the page's text ("12 km", "0.5 m³", "(kg)", "3 litres"). */
export const METRIC_FIGURE = /(?<![\w.])\d[\d,.]*\s?(?:km|cm|mm|m|m²|m³|kg|L)(?![\w²³])|\((?:km|cm|mm|m|m²|m³|kg|L)\)|\b(?:kilo)?metres?\b|\blitres?\b|\bkilograms?\b/g;

/**
 * A pack's own weight in brackets after its weight in pounds ("a 1.1 lb pack (0.5 kg)"): the
 * grower weighs and labels packs in kg, so the product names that weight too, never first.
 */
const AFTER_POUNDS_OF_A_PACK = /\d lb pack \($/;

/** The metric figures a visitor reading in imperial would still meet on this page (a pack's own weight, after its pounds, aside). */
export async function metricFiguresOn(page: Page): Promise<string[]> {
  const text = await page.locator("body").innerText();
  return [...text.matchAll(METRIC_FIGURE)]
    .filter((m) => !(AFTER_POUNDS_OF_A_PACK.test(text.slice(Math.max(0, m.index! - 20), m.index!)) && text[m.index! + m[0].length] === ")"))
    .map((m) => text.slice(Math.max(0, m.index! - 30), m.index! + m[0].length + 10).replace(/\s+/g, " "));
}
