// The kit editor as a designer uses it: drag a pivot and watch the figures follow during the drag, thin
// the neck in the panel, undo, save and reload, meet someone else's save, read a kit as a viewer, and do
// it all from the keyboard. Every test leaves a screenshot of the editor in .data/e2e-shots/editor-*.png.
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { expectAccessible } from "./helpers/a11y";
import { addMemberByInvitation, apiAs, pageAs, signUpByApi, type Account } from "./helpers/accounts";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();
const shots = fileURLToPath(new URL("../../.data/e2e-shots", import.meta.url));
const demo = DEMO_LAYOUTS[0]!;

type Kit = { id: string; version: number; name: string; layout: { drive: { neckDiameterMm: number }; frontView: { lowerOuter: { y: number; z: number } } } };

let owner: Account;
let workspaceId: string;

async function newDemoKit(name = demo.name): Promise<Kit> {
  const { kit } = await apiAs<{ kit: Kit }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name, scale: "1:10", layout: demo.layout } });
  return kit;
}

const kitUrl = (id: string) => `/workspaces/${workspaceId}/kits/${id}`;
const readKit = (id: string, who = owner) => apiAs<{ kit: Kit }>(who, `/api/workspaces/${workspaceId}/kits/${id}`).then((r) => r.kit);

async function shot(page: Page, name: string) {
  mkdirSync(shots, { recursive: true });
  await page.screenshot({ path: join(shots, `editor-${name}.png`) });
}

async function figure(page: Page, id: string): Promise<string> {
  return (await page.getByTestId(id).textContent())!.trim();
}
const number = (text: string) => Number(text.replace(/[^\d.+-]/g, ""));

/** The readouts' sequence number: bumped for every analysis applied. */
async function seq(page: Page): Promise<number> {
  return Number(await page.getByTestId("readouts").getAttribute("data-seq"));
}

/** Waits until a full (not coarse), current analysis newer than `after` is on screen. */
async function settled(page: Page, after: number) {
  await page.waitForFunction(
    (n) => {
      const r = document.querySelector('[data-testid="readouts"]');
      return !!r && Number(r.getAttribute("data-seq")) > n && r.getAttribute("data-quality") === "full" && r.getAttribute("data-stale") === "false";
    },
    after,
    { timeout: 20_000 },
  );
}

async function openEditor(page: Page, id: string) {
  await page.goto(kitUrl(id));
  await page.getByTestId("steer-lock-worst").waitFor();
  await page.locator('[data-testid="view-front"] canvas').first().waitFor();
}

async function centreOf(page: Page, selector: string): Promise<{ x: number; y: number }> {
  const box = await page.locator(selector).boundingBox();
  if (!box) throw new Error(`${selector} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

beforeAll(async () => {
  owner = await signUpByApi("Maren Holt");
  const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
  workspaceId = workspaces[0]!.id;
});

describe("the kit editor", () => {
  it("opens a demo kit with its figures rendered with the page, and passes the accessibility check", async () => {
    const kit = await newDemoKit();
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await page.goto(kitUrl(kit.id));
    // The figures are in the server's HTML: no request to the analysis route is needed to see them.
    const html = await (await page.request.get(kitUrl(kit.id))).text();
    expect(html).toContain('data-testid="steer-lock-worst"');
    await page.locator('[data-testid="view-front"] canvas').first().waitFor();
    expect(await figure(page, "steer-lock-worst")).toMatch(/^\d+\.\d°$/);
    await expectAccessible(page, { name: "editor-open" });
    await page.getByTestId("tab-properties").click();
    await page.getByLabel("Neck diameter").waitFor();
    await expectAccessible(page, { name: "editor-properties" });
    await shot(page, "open");
  });

  it("dragging the lower outer pivot with the mouse changes camber and roll centre during the drag", async () => {
    const kit = await newDemoKit();
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(page, kit.id);
    const camber0 = await figure(page, "camber-bump");
    const rc0 = await figure(page, "roll-centre");
    const from = await centreOf(page, '[data-handle="front:lowerOuter"]');
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) await page.mouse.move(from.x - i, from.y + i * 1.5);
    // Still holding the button: the coarse figures of the dragged layout are already on screen.
    await page.waitForFunction(
      ([c, r]) => {
        const ro = document.querySelector('[data-testid="readouts"]');
        const t = (id: string) => document.querySelector(`[data-testid="${id}"]`)?.textContent?.trim();
        return ro?.getAttribute("data-quality") === "coarse" && t("camber-bump") !== c && t("roll-centre") !== r;
      },
      [camber0, rc0],
      { timeout: 15_000 },
    );
    const during = { camber: await figure(page, "camber-bump"), rc: await figure(page, "roll-centre") };
    await shot(page, "drag");
    const before = await seq(page);
    await page.mouse.up();
    await settled(page, before);
    expect(await page.getByTestId("save-status").getAttribute("data-dirty")).toBe("true");
    expect(await figure(page, "camber-bump")).not.toBe(camber0);
    expect(await figure(page, "roll-centre")).not.toBe(rc0);
    expect(number(during.rc)).not.toBeNaN();
    expect(await page.getByText("NaN").count()).toBe(0);
  });

  it("a thinner neck in the panel: lock rises or holds, the safety factor falls; undo brings the figures back; save and reload keep it", async () => {
    const kit = await newDemoKit();
    const page = await pageAs(browser, owner, { width: 1920, height: 1080 });
    await openEditor(page, kit.id);
    const lock0 = number(await figure(page, "steer-lock-worst"));
    const sf0Text = await figure(page, "safety-factor");
    let before = await seq(page);
    await page.getByTestId("tab-properties").click();
    const neck = page.getByLabel("Neck diameter");
    const thinner = kit.layout.drive.neckDiameterMm - 0.8;
    await neck.fill(String(thinner));
    await neck.press("Enter");
    await page.getByTestId("tab-readouts").click();
    await settled(page, before);
    const lock1 = number(await figure(page, "steer-lock-worst"));
    const sf1 = number(await figure(page, "safety-factor"));
    expect(lock1).toBeGreaterThanOrEqual(lock0);
    expect(sf1).toBeLessThan(number(sf0Text));
    await shot(page, "thin-neck");

    // Undo (focus outside any field) restores the previous figures exactly.
    await page.getByTestId("tab-readouts").focus();
    before = await seq(page);
    await page.keyboard.press("Control+z");
    await settled(page, before);
    expect(await figure(page, "safety-factor")).toBe(sf0Text);
    before = await seq(page);
    await page.keyboard.press("Control+Shift+z");
    await settled(page, before);
    expect(number(await figure(page, "safety-factor"))).toBe(sf1);

    await page.getByTestId("save-layout").click();
    await page.getByText("All changes saved").waitFor();
    const stored = await readKit(kit.id);
    expect(stored.version).toBe(kit.version + 1);
    expect(stored.layout.drive.neckDiameterMm).toBeCloseTo(thinner, 6);
    await page.reload();
    await page.getByTestId("steer-lock-worst").waitFor();
    expect(number(await figure(page, "safety-factor"))).toBe(sf1);
    await page.getByTestId("tab-properties").click();
    expect(Number(await page.getByLabel("Neck diameter").inputValue())).toBeCloseTo(thinner, 6);
  });

  it("picking a point on the neck trade-off sets that neck in the panel, and the figures follow", async () => {
    const kit = await newDemoKit("Trade-off corner");
    const page = await pageAs(browser, owner, { width: 1920, height: 1080 });
    await openEditor(page, kit.id);
    const sf0 = number(await figure(page, "safety-factor"));
    const lock0 = number(await figure(page, "steer-lock-worst"));
    await page.getByTestId("tab-plot-tab-neck").click();
    const plot = page.getByTestId("plot-neck-tradeoff");
    await page.locator('[data-testid="plot-neck-tradeoff"][data-stale="false"]').waitFor();
    // The samples, thinnest first, as the plot's buttons name them (neck-pick-<mm>).
    const diameters = await plot.locator('[data-testid^="neck-pick-"]').evaluateAll((els) =>
      els.map((el) => ({ mm: Number(el.getAttribute("data-testid")!.slice("neck-pick-".length)), ok: !(el as HTMLButtonElement).disabled })),
    );
    const current = kit.layout.drive.neckDiameterMm;
    const k = diameters.findIndex((d) => d.ok && d.mm < current);
    expect(k, "a thinner neck that works is on the curve").toBeGreaterThanOrEqual(0);

    // A click on that point of the steer-lock curve (the chart picks the sample under the pointer).
    let before = await seq(page);
    const dot = plot.locator(".recharts-line-dots").first().locator("circle").nth(k);
    const box = (await dot.boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    await settled(page, before);
    await page.getByTestId("tab-properties").click();
    expect(Number(await page.getByRole("textbox", { name: /^Neck diameter/ }).inputValue())).toBeCloseTo(diameters[k]!.mm, 6);
    await page.getByTestId("tab-readouts").click();
    expect(number(await figure(page, "safety-factor"))).toBeLessThan(sf0);
    expect(number(await figure(page, "steer-lock-worst"))).toBeGreaterThanOrEqual(lock0);
    expect(await page.getByTestId("save-status").getAttribute("data-dirty")).toBe("true");
    await shot(page, "neck-tradeoff");

    // The same from the keyboard: the buttons under the curve, arrow keys and Enter.
    before = await seq(page);
    await plot.getByTestId(`neck-pick-${diameters[k]!.mm}`).focus();
    await page.keyboard.press("ArrowRight");
    await page.keyboard.press("Enter");
    await settled(page, before);
    await page.getByTestId("tab-properties").click();
    expect(Number(await page.getByRole("textbox", { name: /^Neck diameter/ }).inputValue())).toBeCloseTo(diameters[k + 1]!.mm, 6);
    await expectAccessible(page, { name: "editor-neck-tradeoff" });
  });

  it("a save on a stale version offers the choice; saving mine as a new kit loses neither version", async () => {
    const kit = await newDemoKit("Conflict corner");
    const mine = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(mine, kit.id);
    // A second browser context (another tab of the same person) saves first.
    const theirs = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(theirs, kit.id);
    await theirs.getByTestId("tab-properties").click();
    await theirs.getByLabel("Neck diameter").fill("4.2");
    await theirs.getByLabel("Neck diameter").press("Enter");
    await theirs.getByTestId("save-layout").click();
    await theirs.getByText("All changes saved").waitFor();

    await mine.getByTestId("tab-properties").click();
    await mine.getByLabel("Neck diameter").fill("5.4");
    await mine.getByLabel("Neck diameter").press("Enter");
    await mine.getByTestId("save-layout").click();
    const dialog = mine.getByTestId("conflict-dialog");
    await dialog.getByText(`${owner.name} saved version ${kit.version + 1}`).waitFor();
    await expectAccessible(mine, { name: "editor-conflict" });
    await shot(mine, "conflict");
    await dialog.getByRole("button", { name: "Save mine as a new kit" }).click();
    await mine.waitForURL((url) => !url.pathname.endsWith(kit.id));
    const copyId = mine.url().split("/").pop()!;
    await mine.getByTestId("steer-lock-worst").waitFor();
    const original = await readKit(kit.id);
    const copy = await readKit(copyId);
    expect(original.layout.drive.neckDiameterMm).toBe(4.2);
    expect(copy.layout.drive.neckDiameterMm).toBe(5.4);
    expect(copy.name).toBe("Conflict corner (my version)");
  });

  it("loading their version after a conflict keeps mine one undo away", async () => {
    const kit = await newDemoKit("Reload corner");
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(page, kit.id);
    await apiAs(owner, `/api/workspaces/${workspaceId}/kits/${kit.id}/layout`, { method: "PUT", body: { version: kit.version, layout: { ...demo.layout, drive: { ...demo.layout.drive, neckDiameterMm: 4.4 } } } });
    await page.getByTestId("tab-properties").click();
    await page.getByLabel("Neck diameter").fill("5.6");
    await page.getByLabel("Neck diameter").press("Enter");
    await page.getByTestId("save-layout").click();
    await page.getByTestId("conflict-dialog").getByRole("button", { name: "Load their version" }).click();
    await expect.poll(() => page.getByLabel("Neck diameter").inputValue()).toBe("4.4");
    await page.getByTestId("tab-properties").focus();
    await page.keyboard.press("Control+z");
    await expect.poll(() => page.getByLabel("Neck diameter").inputValue()).toBe("5.6");
    // Mine, on top of their version, saves cleanly now.
    await page.getByTestId("save-layout").click();
    await page.getByText("All changes saved").waitFor();
    expect((await readKit(kit.id)).layout.drive.neckDiameterMm).toBe(5.6);
  });

  it("a viewer previews and reads everything, and no control offers a write", async () => {
    const kit = await newDemoKit("Viewer corner");
    const viewer = await signUpByApi("Ola Viewer");
    await addMemberByInvitation(owner, workspaceId, viewer, "viewer");
    const page = await pageAs(browser, viewer, { width: 1280, height: 800 });
    await openEditor(page, kit.id);
    await page.getByTestId("read-only-badge").waitFor();
    expect(await page.getByTestId("save-layout").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Undo" }).count()).toBe(0);
    // Preview still works for a viewer.
    await page.getByTestId("preview-steer").fill("5");
    await page.getByTestId("tab-properties").click();
    expect(await page.getByLabel("Neck diameter").getAttribute("readonly")).not.toBeNull();
    // A drag on a handle changes nothing.
    const from = await centreOf(page, '[data-handle="front:lowerOuter"]');
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let i = 1; i <= 8; i++) await page.mouse.move(from.x, from.y + i * 3);
    await page.mouse.up();
    expect(await page.getByTestId("save-status").count()).toBe(0);
    expect((await readKit(kit.id, viewer)).version).toBe(kit.version);
    await expectAccessible(page, { name: "editor-viewer" });
    await shot(page, "viewer");
  });

  it("the keyboard alone selects a handle, nudges it and saves", async () => {
    const kit = await newDemoKit("Keyboard corner");
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(page, kit.id);
    const handle = page.locator('[data-handle="front:lowerOuter"]');
    // Tab from the front view's Fit button reaches its handles in order.
    await page.getByRole("region", { name: "Front view" }).getByRole("button", { name: "Fit" }).focus();
    for (let i = 0; i < 12 && !(await handle.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press("Tab");
    expect(await handle.evaluate((el) => el === document.activeElement)).toBe(true);
    const before = await seq(page);
    await page.keyboard.press("ArrowUp");
    await page.keyboard.press("Shift+ArrowUp");
    await settled(page, before);
    await page.keyboard.press("Control+s");
    await page.getByText("All changes saved").waitFor();
    const stored = await readKit(kit.id);
    // One grid step (0.5 mm) then ten: 5.5 mm up in z.
    expect(stored.layout.frontView.lowerOuter.z - kit.layout.frontView.lowerOuter.z).toBeCloseTo(5.5, 6);
    await shot(page, "keyboard");
  });

  it("a bellcrank kit: its pivot is a handle of the top view, moving it changes the stop (an angle), and the panel switches back to a rack", async () => {
    const bellcrank = DEMO_LAYOUTS.find((d) => d.key === "tarnwick-10-bellcrank")!;
    const { kit } = await apiAs<{ kit: Kit }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: bellcrank.name, scale: "1:10", layout: bellcrank.layout } });
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(page, kit.id);
    expect(await figure(page, "steering-stop")).toMatch(/^\d+\.\d°$/);
    const stop0 = await figure(page, "steering-stop");
    // Move the pivot 3 mm rearward with the keyboard (six grid steps up the top view, where forward is down):
    // a 12 mm arm instead of 15 mm turns further for the same inner-ball travel, so the stop angle changes.
    const pivot = page.locator('[data-handle="top:bellcrankPivot"]');
    await pivot.focus();
    const before = await seq(page);
    for (let i = 0; i < 6; i++) await page.keyboard.press("ArrowUp");
    await settled(page, before);
    expect(await figure(page, "steering-stop")).not.toBe(stop0);
    await page.getByTestId("tab-properties").click();
    await page.getByLabel("Steering input").selectOption("rack");
    await page.getByLabel("Rack travel each way").waitFor();
    await page.getByTestId("tab-readouts").click();
    await page.waitForFunction(() => /mm$/.test(document.querySelector('[data-testid="steering-stop"]')?.textContent?.trim() ?? ""), undefined, { timeout: 20_000 });
    await expectAccessible(page, { name: "editor-bellcrank-to-rack" });
    await shot(page, "bellcrank");
  });

  it.each([[1280, 800], [1920, 1080]])("at %i×%i no panel overlaps another", async (width, height) => {
    const kit = await newDemoKit();
    const page = await pageAs(browser, owner, { width, height });
    await openEditor(page, kit.id);
    const boxes = await page.evaluate(() =>
      ["view-front", "view-top", "view-joint", "editor-plots-area", "editor-side"].map((id) => {
        const el = document.querySelector(`[data-testid="${id}"]`);
        const r = el!.getBoundingClientRect();
        return { id, x: r.x, y: r.y, w: r.width, h: r.height };
      }),
    );
    for (const b of boxes) {
      expect(b.w, `${b.id} width`).toBeGreaterThan(150);
      expect(b.h, `${b.id} height`).toBeGreaterThan(150);
      expect(b.x + b.w, `${b.id} inside the window`).toBeLessThanOrEqual(width + 0.5);
      expect(b.y + b.h, `${b.id} inside the window`).toBeLessThanOrEqual(height + 0.5);
    }
    for (const a of boxes) for (const b of boxes) {
      if (a.id >= b.id) continue;
      const overlapX = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
      const overlapY = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
      expect(overlapX > 0.5 && overlapY > 0.5, `${a.id} overlaps ${b.id}`).toBe(false);
    }
    await shot(page, `size-${width}x${height}`);
  });
});
