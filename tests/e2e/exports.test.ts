// Exports from the editor in a real browser: the Export menu (checked for accessibility while open), the
// dimension sheet's progress and its download, and a viewer's DXF and SVG downloads. The files land in
// .data/e2e-downloads/ to look at.
import { mkdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { expectAccessible } from "./helpers/a11y";
import { addMemberByInvitation, apiAs, pageAs, signUpByApi, type Account } from "./helpers/accounts";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();
const downloads = fileURLToPath(new URL("../../.data/e2e-downloads", import.meta.url));
const demo = DEMO_LAYOUTS[0]!;

let owner: Account;
let workspaceId: string;
let kitId: string;

beforeAll(async () => {
  owner = await signUpByApi("Sola Brennan");
  const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
  workspaceId = workspaces[0]!.id;
  const { kit } = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: demo.name, scale: "1:10", layout: demo.layout } });
  kitId = kit.id;
});

async function openEditor(page: Page) {
  await page.goto(`/workspaces/${workspaceId}/kits/${kitId}`);
  await page.getByTestId("steer-lock-worst").waitFor();
}

/** Every text the export status shows from now on (the progress can be brief on a fast machine). */
async function recordStatus(page: Page) {
  await page.evaluate(() => {
    const el = document.querySelector('[data-testid="export-status"]')!;
    const seen: string[] = [];
    (window as unknown as { exportStatusSeen: string[] }).exportStatusSeen = seen;
    new MutationObserver(() => seen.push(`${el.textContent}${el.querySelector("progress") ? " [progress]" : ""}`)).observe(el, { childList: true, subtree: true, characterData: true });
  });
}

describe("exports from the editor", () => {
  it("makes the dimension sheet with its progress shown, and saves it under the kit's name", async () => {
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await openEditor(page);
    await page.getByTestId("export-menu").click();
    await page.getByLabel("Paper").selectOption("letter");
    await page.getByLabel("Orientation").selectOption("landscape");
    await expectAccessible(page, { name: "editor-export-menu" });
    await recordStatus(page);
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-sheet").click()]);
    expect(download.suggestedFilename()).toBe("tarnwick-10-5-0-mm-steel-dogbone-rev1-sheet.pdf");
    mkdirSync(downloads, { recursive: true });
    const file = join(downloads, download.suggestedFilename());
    await download.saveAs(file);
    expect(readFileSync(file).subarray(0, 5).toString()).toBe("%PDF-");
    await expect.poll(() => page.getByTestId("export-status").textContent()).toBe("Saved tarnwick-10-5-0-mm-steel-dogbone-rev1-sheet.pdf (version 1).");
    const seen = await page.evaluate(() => (window as unknown as { exportStatusSeen: string[] }).exportStatusSeen);
    expect(seen.some((s) => s.startsWith("Making the dimension sheet…") && s.endsWith("[progress]")), seen.join(" | ")).toBe(true);
  });

  it("a viewer downloads the views for CAD and a view as SVG", async () => {
    const viewer = await signUpByApi("Tam Oduya");
    await addMemberByInvitation(owner, workspaceId, viewer, "viewer");
    const page = await pageAs(browser, viewer, { width: 1280, height: 800 });
    await openEditor(page);
    await page.getByTestId("read-only-badge").waitFor();
    for (const [id, name] of [["export-views.dxf", "views.dxf"], ["export-front.svg", "front.svg"]] as const) {
      await page.getByTestId("export-menu").click();
      const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId(id).click()]);
      expect(download.suggestedFilename()).toBe(`tarnwick-10-5-0-mm-steel-dogbone-rev1-${name}`);
      const file = join(downloads, `viewer-${download.suggestedFilename()}`);
      await download.saveAs(file);
      const text = readFileSync(file, "utf8");
      expect(text).toContain(name.endsWith(".dxf") ? "ARMS" : 'data-part="lower-arm"');
    }
  });
});
