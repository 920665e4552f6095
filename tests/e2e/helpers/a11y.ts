// Accessibility check for browser tests: axe-core's WCAG 2.0/2.1 A and AA rules on the page as it is
// now, failing on any violation of impact "serious" or "critical". Every call leaves the full axe
// result in .data/e2e-axe/NAME.json and a full-page screenshot in .data/e2e-shots/a11y-NAME.png.
//
//   await page.getByRole("heading", { name: "Kits" }).waitFor();   // first wait for what is checked
//   await expectAccessible(page, { name: "kits-empty" });
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";

export type AxeResults = Awaited<ReturnType<AxeBuilder["analyze"]>>;
export type AxeViolation = AxeResults["violations"][number];

export const WCAG_TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"] as const;
const BLOCKING_IMPACTS = new Set(["serious", "critical"]);

const dataDir = fileURLToPath(new URL("../../../.data", import.meta.url));
export const axeDir = join(dataDir, "e2e-axe");
const shotsDir = join(dataDir, "e2e-shots");

export interface AccessibleOptions {
  /** Names the artifacts (.data/e2e-axe/NAME.json, .data/e2e-shots/a11y-NAME.png) and the failure. */
  name: string;
  /** CSS selectors left out of the check: only for third-party markup we cannot change, with a reason beside the call. */
  exclude?: string[];
}

/** The violations that fail the check: impact serious or critical. */
export function blockingViolations(results: Pick<AxeResults, "violations">): AxeViolation[] {
  return results.violations.filter((v) => v.impact != null && BLOCKING_IMPACTS.has(v.impact));
}

/** One block per rule: id, impact, help, then each failing node's target selector and axe's summary. */
export function describeViolations(violations: readonly AxeViolation[]): string {
  return violations
    .map((v) => {
      const nodes = v.nodes.map((n) => {
        const summary = (n.failureSummary ?? "").replace(/\s*\n\s*/g, " ").trim();
        return `    - ${n.target.map(String).join(" >> ")}\n      ${summary}`;
      });
      return `  [${v.impact}] ${v.id}: ${v.help} (${v.nodes.length} node${v.nodes.length === 1 ? "" : "s"})\n${nodes.join("\n")}`;
    })
    .join("\n");
}

const fileName = (name: string) => name.replace(/[^\w.-]+/g, "_");

/** Runs axe on the page; throws a readable error listing every serious or critical violation. */
export async function expectAccessible(page: Page, { name, exclude = [] }: AccessibleOptions): Promise<AxeResults> {
  let builder = new AxeBuilder({ page }).withTags([...WCAG_TAGS]);
  for (const selector of exclude) builder = builder.exclude(selector);
  const results = await builder.analyze();

  mkdirSync(axeDir, { recursive: true });
  mkdirSync(shotsDir, { recursive: true });
  const resultPath = join(axeDir, `${fileName(name)}.json`);
  writeFileSync(resultPath, JSON.stringify(results, null, 2));
  await page.screenshot({ path: join(shotsDir, `a11y-${fileName(name)}.png`), fullPage: true });

  const blocking = blockingViolations(results);
  if (blocking.length > 0) {
    throw new Error(
      `axe found ${blocking.length} serious or critical WCAG 2 A/AA violation${blocking.length === 1 ? "" : "s"} on "${name}" (${page.url()}):\n` +
        `${describeViolations(blocking)}\nfull result: ${resultPath}`,
    );
  }
  return results;
}
