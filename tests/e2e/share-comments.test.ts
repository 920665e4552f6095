// Share links and comments in a real browser: an editor makes a link in the Share tab; members pin comments
// to the drawing (markup stays text, nothing runs), and another member sees a new one without reloading;
// an anonymous reviewer opens the link (read-only, noindex), downloads the sheet, and comments under a name;
// once revoked, the link's page is a 404. The Share tab, the Comments tab and the shared page pass axe.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { expectAccessible } from "./helpers/a11y";
import { addMemberByInvitation, apiAs, pageAs, signUpByApi, type Account } from "./helpers/accounts";
import { baseUrl, setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();
const downloads = fileURLToPath(new URL("../../.data/e2e-downloads", import.meta.url));
const demo = DEMO_LAYOUTS[0]!;
const KIT_NAME = `Pellworth <b>8</b> <img src=x onerror="window.__kbInjected=1">`;
const BODY = `Check the <script>window.__kbInjected=2</script> cup <img src=x onerror="window.__kbInjected=3"> mouth`;

let owner: Account;
let viewer: Account;
let workspaceId: string;
let kitId: string;
let shareUrl: string;

beforeAll(async () => {
  owner = await signUpByApi("Wynn Tarrant");
  viewer = await signUpByApi("Ossian Pell");
  const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
  workspaceId = workspaces[0]!.id;
  await addMemberByInvitation(owner, workspaceId, viewer, "viewer");
  const { kit } = await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, { method: "POST", body: { name: KIT_NAME, scale: "1:8", layout: demo.layout } });
  kitId = kit.id;
});

async function openEditor(page: Page) {
  await page.goto(`/workspaces/${workspaceId}/kits/${kitId}`);
  await page.getByTestId("steer-lock-worst").waitFor();
  await page.locator('[data-testid="view-front"] canvas').first().waitFor();
}

const injected = (page: Page) => page.evaluate(() => (window as unknown as { __kbInjected?: number }).__kbInjected ?? null);

describe("share links and comments", () => {
  it("an editor makes a link with comments allowed in the Share tab", async () => {
    const page = await pageAs(browser, owner, { width: 1400, height: 900 });
    await openEditor(page);
    await page.getByTestId("tab-share").click();
    await page.getByTestId("share-allow-comments").check();
    await page.getByLabel("Expires").selectOption("7");
    await page.getByTestId("share-create").click();
    shareUrl = await page.getByTestId("share-url").inputValue();
    expect(shareUrl).toMatch(new RegExp(`^${baseUrl.replace(/[.:/]/g, "\\$&")}/shared/[A-Za-z0-9_-]{43}$`));
    await expect.poll(() => page.getByTestId("share-link-row").count()).toBe(1);
    await expectAccessible(page, { name: "kit-editor-share-tab" });
    // A viewer has no Share tab.
    const vpage = await pageAs(browser, viewer, { width: 1400, height: 900 });
    await openEditor(vpage);
    expect(await vpage.getByTestId("tab-share").count()).toBe(0);
  });

  it("a member pins a comment to the front view; markup shows as text; another member sees it without reloading", async () => {
    const vpage = await pageAs(browser, viewer, { width: 1400, height: 900 });
    await openEditor(vpage);
    await vpage.getByTestId("tab-comments").click();
    await vpage.getByTestId("comments-empty").waitFor();

    const page = await pageAs(browser, owner, { width: 1400, height: 900 });
    await openEditor(page);
    expect(await page.locator("h1").first().textContent()).toBe(KIT_NAME);
    await page.getByTestId("tab-comments").click();
    await page.getByTestId("add-comment").click();
    await page.getByTestId("comment-hint-front").waitFor();
    const box = (await page.getByTestId("view-front").boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.4, box.y + box.height * 0.5);
    await page.getByTestId("comment-pending-pin").waitFor();
    await page.getByTestId("new-comment-form").getByRole("textbox").fill(BODY);
    await expectAccessible(page, { name: "kit-editor-comment-form" });
    await page.getByTestId("new-comment-form").getByRole("button", { name: "Post comment" }).click();
    await page.getByTestId("comment-thread").first().waitFor();
    expect(await page.getByTestId("comment-body").first().textContent()).toBe(BODY);
    await page.locator('[data-testid="view-front"] [data-comment-marker="1"]').waitFor();
    expect(await injected(page)).toBeNull();
    await expectAccessible(page, { name: "kit-editor-comments" });

    // The viewer's open page gets it by polling, and replies.
    await vpage.getByTestId("comment-thread").first().waitFor({ timeout: 20_000 });
    expect(await vpage.getByTestId("comment-body").first().textContent()).toBe(BODY);
    expect(await injected(vpage)).toBeNull();
    await vpage.getByRole("button", { name: "Reply" }).click();
    await vpage.getByTestId("reply-form").getByRole("textbox").fill("Chamfer is 0.3 mm");
    await vpage.getByTestId("reply-form").getByRole("button", { name: "Reply" }).click();
    await expect.poll(() => vpage.getByTestId("comment-body").allTextContents()).toEqual([BODY, "Chamfer is 0.3 mm"]);
    // Resolve, then show resolved and reopen.
    await vpage.getByRole("button", { name: "Resolve" }).click();
    await vpage.getByTestId("comments-empty").waitFor();
    await vpage.getByLabel(/Show resolved/).check();
    await vpage.getByRole("button", { name: "Reopen" }).click();
    await vpage.getByLabel(/Show resolved/).waitFor({ state: "detached" });
    await vpage.getByRole("button", { name: "Resolve" }).waitFor();
  });

  it("an anonymous reviewer reads the shared kit read-only, downloads the sheet and comments under a name", async () => {
    const page = await browser.newPage({ width: 1400, height: 900 });
    const res = await page.goto(shareUrl);
    expect(res!.status()).toBe(200);
    expect(res!.headers()["x-robots-tag"]).toBe("noindex, nofollow");
    expect(await page.locator('meta[name="robots"]').getAttribute("content")).toMatch(/noindex/);
    await page.getByTestId("steer-lock-worst").waitFor();
    await page.locator('[data-testid="view-top"] canvas').first().waitFor();
    expect(await page.getByTestId("shared-kit-name").textContent()).toBe(KIT_NAME);
    expect(await page.getByTestId("read-only-badge").textContent()).toBe("Shared read-only");
    // No edit control: no save, no properties, no note, no undo.
    for (const id of ["save-layout", "revision-note", "tab-properties", "tab-share"]) expect(await page.getByTestId(id).count(), id).toBe(0);
    expect(await page.getByRole("button", { name: "Undo" }).count()).toBe(0);
    await expectAccessible(page, { name: "shared-kit" });

    await page.getByTestId("tab-downloads").click();
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("shared-download-sheet.pdf").click()]);
    expect(download.suggestedFilename()).toMatch(/^pellworth-b-8-b-img-src-x-onerror-window-kbinjected-1-rev1-sheet\.pdf$/);
    mkdirSync(downloads, { recursive: true });
    const file = join(downloads, `shared-${download.suggestedFilename()}`);
    await download.saveAs(file);
    expect(readFileSync(file).subarray(0, 5).toString()).toBe("%PDF-");

    await page.getByTestId("tab-comments").click();
    await page.getByTestId("comment-thread").first().waitFor();
    expect(await page.getByTestId("comment-body").first().textContent()).toBe(BODY);
    // A reviewer neither resolves nor deletes.
    expect(await page.getByRole("button", { name: "Resolve" }).count()).toBe(0);
    await page.getByTestId("add-comment").click();
    await page.getByTestId("comment-hint-top").waitFor();
    await page.getByTestId("view-top").getByRole("button", { name: "Pin at the centre" }).click();
    await page.getByLabel("Your name").fill("<i>Guest</i> reviewer");
    await page.getByTestId("new-comment-form").getByRole("textbox", { name: "Post comment" }).fill("Top view <b>looks</b> right");
    await page.getByTestId("new-comment-form").getByRole("button", { name: "Post comment" }).click();
    await expect.poll(() => page.getByTestId("comment-thread").count()).toBe(2);
    await page.locator('[data-testid="view-top"] [data-comment-marker="2"]').waitFor();
    expect(await page.getByText("<i>Guest</i> reviewer").count()).toBe(1);
    expect(await injected(page)).toBeNull();
    await expectAccessible(page, { name: "shared-kit-comments" });

    // The members see the reviewer's comment.
    const { threads } = await apiAs<{ threads: { body: string; authorName: string; viaShareLink: boolean }[] }>(owner, `/api/workspaces/${workspaceId}/kits/${kitId}/comments`);
    expect(threads.find((t) => t.viaShareLink)).toMatchObject({ body: "Top view <b>looks</b> right", authorName: "<i>Guest</i> reviewer" });
  });

  it("once revoked in the Share tab, the link's page answers 404", async () => {
    const page = await pageAs(browser, owner, { width: 1400, height: 900 });
    await openEditor(page);
    await page.getByTestId("tab-share").click();
    await page.getByRole("button", { name: /^Revoke the link/ }).click();
    await page.getByTestId("share-link-row").getByText("Revoked").waitFor();
    const anon = await browser.newPage({ width: 1000, height: 700 });
    const res = await anon.goto(shareUrl);
    expect(res!.status()).toBe(404);
  });
});
