// Exports in a real browser: from the editor, the Export menu (checked for accessibility while open), the
// dimension sheet's progress and its download, and a viewer's DXF and SVG downloads; from the compare page,
// the combined sheet of two kits (its progress, its pages read back with pdftotext) and one item's sheet.
// The files land in .data/e2e-downloads/ to look at.
import { execFileSync } from "node:child_process";
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
const other = DEMO_LAYOUTS[1]!;

let owner: Account;
let workspaceId: string;
let kitId: string;
let otherKitId: string;

beforeAll(async () => {
  owner = await signUpByApi("Sola Brennan");
  const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
  workspaceId = workspaces[0]!.id;
  const { kit } = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: demo.name, scale: "1:10", layout: demo.layout } });
  kitId = kit.id;
  const second = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: other.name, scale: "1:10", layout: other.layout } });
  otherKitId = second.kit.id;
});

async function openEditor(page: Page) {
  await page.goto(`/workspaces/${workspaceId}/kits/${kitId}`);
  await page.getByTestId("steer-lock-worst").waitFor();
}

/** Every text the export status shows from now on (the progress can be brief on a fast machine). */
async function recordStatus(page: Page, testId = "export-status") {
  await page.evaluate((id) => {
    const el = document.querySelector(`[data-testid="${id}"]`)!;
    const seen: string[] = [];
    (window as unknown as { exportStatusSeen: string[] }).exportStatusSeen = seen;
    new MutationObserver(() => seen.push(`${el.textContent}${el.querySelector("progress") ? " [progress]" : ""}`)).observe(el, { childList: true, subtree: true, characterData: true });
  }, testId);
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

describe("exports of an earlier revision", () => {
  it("the editor showing revision 1 read-only exports revision 1, not the latest", async () => {
    const { kit } = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: "Pinned corner", scale: "1:10", layout: demo.layout } });
    await apiAs(owner, `/api/workspaces/${workspaceId}/kits/${kit.id}/layout`, { method: "PUT", body: { version: 1, layout: other.layout } });
    const page = await pageAs(browser, owner, { width: 1280, height: 800 });
    await page.goto(`/workspaces/${workspaceId}/kits/${kit.id}?revision=1`);
    await page.getByTestId("revision-banner").waitFor();
    await page.getByTestId("export-menu").click();
    await page.getByText("Of revision 1, as shown").waitFor();
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-sheet").click()]);
    expect(download.suggestedFilename()).toBe("pinned-corner-rev1-sheet.pdf");
    await expect.poll(() => page.getByTestId("export-status").textContent()).toBe("Saved pinned-corner-rev1-sheet.pdf (revision 1).");
  });
});

describe("sheets from the compare page", () => {
  it("downloads the combined sheet of both kits, with its progress shown, in the paper and unit chosen", async () => {
    const viewer = await signUpByApi("Ines Valdane");
    await addMemberByInvitation(owner, workspaceId, viewer, "viewer");
    const page = await pageAs(browser, viewer, { width: 1280, height: 900 });
    await page.goto(`/workspaces/${workspaceId}/compare?items=${kitId},${otherKitId}`);
    const sheets = page.getByTestId("compare-sheets");
    await sheets.waitFor();
    await sheets.getByLabel("Paper").selectOption("letter");
    await sheets.getByLabel("Orientation").selectOption("landscape");
    await sheets.getByLabel("Lengths in").selectOption("in");
    await recordStatus(page, "compare-sheet-status");
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("compare-sheet-combined").click()]);
    expect(download.suggestedFilename()).toBe("compare-tarnwick-10-5-0-mm-steel-dogbone-rev1-tarnwick-10-4-0-mm-steel-dogbone-rev1-sheet.pdf");
    mkdirSync(downloads, { recursive: true });
    const file = join(downloads, download.suggestedFilename());
    await download.saveAs(file);
    await expect.poll(() => page.getByTestId("compare-sheet-status").textContent()).toBe(`Saved ${download.suggestedFilename()}.`);
    const seen = await page.evaluate(() => (window as unknown as { exportStatusSeen: string[] }).exportStatusSeen);
    expect(seen.some((s) => s.startsWith("Making the combined sheet of 2 kits…") && s.endsWith("[progress]")), seen.join(" | ")).toBe(true);
    // Letter landscape, and each kit's page set: its drawing page with the title block naming kit and revision.
    expect(execFileSync("pdfinfo", [file], { encoding: "utf8" })).toMatch(/Page size:\s+792 x 612 pts \(letter\)/);
    const pages = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", file, "-"], { encoding: "utf8" }).split("\f");
    const drawings = pages.filter((p) => p.includes("Dimension sheet"));
    expect(drawings).toHaveLength(2);
    expect(drawings[0]).toMatch(/Tarnwick 10 — 5\.0 mm steel dogbone +1 +1 of \d/);
    expect(drawings[1]).toMatch(/Tarnwick 10 — 4\.0 mm steel dogbone +1 +1 of \d/);
    for (const d of drawings) expect(d).toContain("inches, degrees");
    await expectAccessible(page, { name: "compare-sheet-saved" });
    // One item's sheet: its kit's own, pinned to the revision compared.
    const [single] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: `Sheet of B: ${other.name}, revision 1` }).click()]);
    expect(single.suggestedFilename()).toBe("tarnwick-10-4-0-mm-steel-dogbone-rev1-sheet.pdf");
    await single.saveAs(join(downloads, `compare-${single.suggestedFilename()}`));
    expect(readFileSync(join(downloads, `compare-${single.suggestedFilename()}`)).subarray(0, 5).toString()).toBe("%PDF-");
  });
});
