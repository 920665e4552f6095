// The methods page as a reader meets it: public, an anchor for every output field's entry and every
// citation key; the kit page's figures explain themselves on hover and focus and lead to their entry; and
// nothing the API answers or the kit page shows refers to a document outside the product.
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { OUTPUT_FIELDS, outputFieldCitations } from "@/engine/output-fields";
import { expectAccessible } from "./helpers/a11y";
import { apiAs, pageAs, signUpByApi, type Account } from "./helpers/accounts";
import { baseUrl, setUpBrowser } from "./helpers/browser";
import { OUTSIDE_REFERENCE } from "../helpers/outside-reference";

const browser = setUpBrowser();


let owner: Account;
let workspaceId: string;

beforeAll(async () => {
  owner = await signUpByApi("Oriel Vance");
  const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
  workspaceId = workspaces[0]!.id;
});

async function newKit(name: string, layout: unknown): Promise<string> {
  const { kit } = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name, scale: "1:10", layout } });
  return kit.id;
}

async function openKit(page: Page, id: string) {
  await page.goto(`/workspaces/${workspaceId}/kits/${id}`);
  await page.getByTestId("steer-lock-worst").waitFor();
}

describe("the methods page", () => {
  it("is public, and every output field's entry and citation keys resolve on it", async () => {
    const res = await fetch(`${baseUrl}/methods`, { redirect: "manual" });
    expect(res.status).toBe(200);
    const html = await res.text();
    const ids = new Set([...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]!));
    for (const f of OUTPUT_FIELDS) {
      expect(ids.has(f.method), `${f.path} → /methods#${f.method}`).toBe(true);
      for (const k of outputFieldCitations(f)) expect(ids.has(k), `${f.path} → /methods#${k}`).toBe(true);
    }
    expect(html).not.toMatch(OUTSIDE_REFERENCE);
  });
});

describe("no answer of the API and no text of the kit page refers to a file outside the product", () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s", async (key, layout) => {
    const answer = await apiAs<unknown>(owner, "/api/analyze", { method: "POST", body: { layout, grid: { travelSteps: 7, steerSteps: 9 } } });
    expect(JSON.stringify(answer)).not.toMatch(OUTSIDE_REFERENCE);
    const id = await newKit(`Sources ${key}`, layout);
    const stored = await apiAs<unknown>(owner, `/api/workspaces/${workspaceId}/kits/${id}/analyze`, { method: "POST" });
    expect(JSON.stringify(stored)).not.toMatch(OUTSIDE_REFERENCE);

    const page = await pageAs(browser, owner, { width: 1280, height: 900 });
    await openKit(page, id);
    const texts: string[] = [];
    // Every side tab and every plot tab, as a reader would open them.
    for (const tab of ["tab-readouts", "tab-properties", "tab-sheet"]) {
      await page.getByTestId(tab).click();
      texts.push(await page.locator("body").innerText());
    }
    for (const tab of ["tab-plot-tab-travel", "tab-plot-tab-envelope", "tab-plot-tab-ackermann", "tab-plot-tab-neck"]) {
      await page.getByTestId(tab).click();
      texts.push(await page.locator("body").innerText());
    }
    const html = await page.content();
    for (const t of texts) expect(t).not.toMatch(OUTSIDE_REFERENCE);
    expect(html).not.toMatch(/\bREFERENCES\b/);
    // Every figure's link goes to an anchor of the methods page.
    const hrefs = await page.locator('a[href^="/methods#"]').evaluateAll((as) => as.map((a) => a.getAttribute("href")));
    expect(hrefs.length).toBeGreaterThan(20);
  });
});

describe("a figure's explanation leads to its methods entry", () => {
  it("reads the steer lock's explanation on focus and on hover, follows it to /methods#steer-lock, and the methods page passes the accessibility check", async () => {
    const id = await newKit("Explained corner", DEMO_LAYOUTS[0]!.layout);
    const page = await pageAs(browser, owner, { width: 1280, height: 900 });
    await openKit(page, id);

    // Keyboard: focus the figure's label; its explanation shows and describes the link.
    const label = page.getByTestId("explain-steer-lock-worst");
    await label.focus();
    const tipId = await label.getAttribute("aria-describedby");
    const tip = page.locator(`[id="${tipId}"]`);
    await tip.waitFor({ state: "visible" });
    expect(await tip.innerText()).toMatch(/outer wheel can set it/);
    await page.keyboard.press("Escape");
    await tip.waitFor({ state: "hidden" });

    // Pointer: hovering another figure shows its own explanation.
    const stop = page.getByTestId("explain-steering-stop");
    await stop.hover();
    const stopTip = page.locator(`[id="${await stop.getAttribute("aria-describedby")}"]`);
    await stopTip.waitFor({ state: "visible" });
    expect(await stopTip.innerText()).toMatch(/Where a stop must sit/);

    // Follow the steer lock's link (a new tab, so the editor and its unsaved work stay put).
    await label.focus();
    const [methods] = await Promise.all([page.context().waitForEvent("page"), page.keyboard.press("Enter")]);
    await methods.waitForLoadState("load");
    expect(new URL(methods.url()).pathname).toBe("/methods");
    expect(new URL(methods.url()).hash).toBe("#steer-lock");
    const entry = methods.locator('[id="steer-lock"]');
    await entry.getByRole("heading", { name: "Steer lock" }).waitFor();
    expect(await entry.innerText()).toMatch(/one input position for the car, limited by whichever wheel binds first/);
    // The anchor brought the entry into view.
    const top = await entry.evaluate((e) => e.getBoundingClientRect().top);
    expect(Math.abs(top)).toBeLessThan(100);
    await expectAccessible(methods, { name: "methods" });
  });
});
