// Every page the app has passes axe-core's WCAG 2 A/AA rules with no serious or critical violation,
// in each state a person meets it in (empty, filled, with validation errors). Results and screenshots
// land in .data/e2e-axe/ and .data/e2e-shots/.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { blockingViolations, expectAccessible } from "./helpers/a11y";
import { addMemberByInvitation, apiAs, pageAs as openAs, signUpByApi, type Account } from "./helpers/accounts";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();

const pageAs = (account: Account) => openAs(browser, account);

describe("the accessibility check itself", () => {
  it("fails on grey text that does not reach 4.5:1 and names the rule, the impact and the element", async () => {
    const page = await browser.newPage();
    await page.setContent(
      `<!doctype html><html lang="en"><head><title>Contrast probe</title></head><body><main><h1>Probe</h1>` +
        `<p id="faint" style="color:#999;background:#fff">Hint text at 2.8:1</p></main></body></html>`,
    );
    const failure = await expectAccessible(page, { name: "probe-low-contrast" }).then(
      () => null,
      (error: Error) => error,
    );
    expect(failure?.message).toMatch(/\[serious\] color-contrast/);
    expect(failure?.message).toContain("#faint");
    expect(failure?.message).toMatch(/contrast of 2\.8/);
  });

  it("passes the same text once it reaches 4.5:1", async () => {
    const page = await browser.newPage();
    await page.setContent(
      `<!doctype html><html lang="en"><head><title>Contrast probe</title></head><body><main><h1>Probe</h1>` +
        `<p style="color:#595959;background:#fff">Hint text at 7:1</p></main></body></html>`,
    );
    const results = await expectAccessible(page, { name: "probe-good-contrast" });
    expect(blockingViolations(results)).toEqual([]);
    expect(results.passes.map((p) => p.id)).toContain("color-contrast");
  });
});

describe("signed-out pages", () => {
  it("home", async () => {
    const page = await browser.newPage();
    await page.goto("/");
    await page.getByRole("heading", { name: "Knucklebench", level: 1 }).waitFor();
    await expectAccessible(page, { name: "home" });
  });

  it("sign-in", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-in");
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    await expectAccessible(page, { name: "sign-in" });
  });

  it("sign-in with its validation errors shown", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-in");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.locator("#email-error").waitFor();
    await expectAccessible(page, { name: "sign-in-errors" });
  });

  it("sign-up", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-up");
    await page.getByRole("heading", { name: "Create your account" }).waitFor();
    await expectAccessible(page, { name: "sign-up" });
  });

  it("sign-up with its validation errors shown", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-up");
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.locator("#name-error").waitFor();
    await page.locator("#password-error").waitFor();
    expect(await page.getByLabel("Password").getAttribute("aria-invalid")).toBe("true");
    await expectAccessible(page, { name: "sign-up-errors" });
  });

  it("a page that does not exist (404)", async () => {
    const page = await browser.newPage();
    const response = await page.goto("/no-such-page");
    expect(response?.status()).toBe(404);
    await page.getByText(/could not be found/i).first().waitFor();
    await expectAccessible(page, { name: "not-found" });
  });
});

describe("signed-in pages", () => {
  let owner: Account;
  let collaborator: Account;
  let workspaceId: string;
  let kitId: string | undefined;

  beforeAll(async () => {
    owner = await signUpByApi("Mara Kestrel");
    collaborator = await signUpByApi("Jonas Pell");
    const { workspaces } = await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces");
    workspaceId = workspaces[0].id;
  });

  const ensureKit = async () => {
    kitId ??= (await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${workspaceId}/kits`, {
      method: "POST",
      body: { name: "Tarnwick 10 front corner", scale: "1:10", notes: "4 mm neck, printed knuckle" },
    })).kit.id;
    return kitId;
  };

  // Runs before any kit exists in the owner's workspace (vitest keeps the order within a file).
  it("kits list, empty", async () => {
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/kits`);
    await page.getByText("No kits yet").waitFor();
    await expectAccessible(page, { name: "kits-empty" });
  });

  it("kits list with a kit", async () => {
    await ensureKit();
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/kits`);
    await page.getByRole("table", { name: "Kits" }).getByText("Tarnwick 10 front corner").waitFor();
    await expectAccessible(page, { name: "kits-with-kit" });
  });

  it("kits list with the delete confirmation open", async () => {
    await ensureKit();
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/kits`);
    await page.getByRole("button", { name: "Delete Tarnwick 10 front corner" }).click();
    await page.getByTestId("delete-dialog").getByText(/revisions are removed/).waitFor();
    await expectAccessible(page, { name: "kits-confirm-delete" });
  });

  it("kits list with the new-kit form's errors shown", async () => {
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/kits`);
    await page.getByTestId("new-kit").click();
    await page.getByRole("button", { name: "Create kit" }).click();
    await page.locator("#kit-name-error").waitFor();
    await expectAccessible(page, { name: "kits-new-kit-errors" });
  });

  it("a kit's page, once its figures and charts are drawn", async () => {
    const id = await ensureKit();
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/kits/${id}`);
    await page.getByTestId("tab-sheet").click();
    await page.getByRole("region", { name: "Steer lock" }).getByText("Limited by").waitFor();
    await page.getByRole("table", { name: "Neck diameter what-if" }).waitFor();
    await page.locator("figure .recharts-line").nth(5).waitFor();
    // Each chart's svg is focusable (recharts' keyboard layer), so it carries its caption as its name.
    for (const chart of ["Camber and roll centre over travel", "Steer lock over travel", "Joint angle over rack travel (static)"]) {
      await page.getByTestId("analysis-sheet").getByRole("application", { name: chart }).waitFor();
    }
    await expectAccessible(page, { name: "kit-sheet" });
  });

  it("members, as the owner, with a second member", async () => {
    await addMemberByInvitation(owner, workspaceId, collaborator, "editor");
    // And one invitation still waiting, so the pending list is checked too.
    await apiAs(owner, `/api/workspaces/${workspaceId}/members`, { method: "POST", body: { email: "waiting@test.example", role: "viewer" } });
    const page = await pageAs(owner);
    await page.goto(`/workspaces/${workspaceId}/members`);
    await page.getByRole("combobox", { name: "Role of Jonas Pell" }).waitFor();
    await page.getByRole("button", { name: "Withdraw the invitation to waiting@test.example" }).waitFor();
    await expectAccessible(page, { name: "members-owner" });
  });

  it("members, as an editor (read only)", async () => {
    const page = await pageAs(collaborator);
    await page.goto(`/workspaces/${workspaceId}/members`);
    await page.getByRole("cell", { name: "Mara Kestrel" }).waitFor();
    await expectAccessible(page, { name: "members-editor" });
  });

  it("new workspace, also with its validation error shown", async () => {
    const page = await pageAs(owner);
    await page.goto("/workspaces/new");
    await page.getByRole("heading", { name: "New workspace" }).waitFor();
    await expectAccessible(page, { name: "new-workspace" });
    await page.getByRole("button", { name: "Create workspace" }).click();
    await page.locator("#workspace-name-error").waitFor();
    await expectAccessible(page, { name: "new-workspace-errors" });
  });

  it("a workspace the user is not a member of (404 inside the app)", async () => {
    const page = await pageAs(owner);
    const response = await page.goto(`/workspaces/${randomUUID()}/kits`);
    expect(response?.status()).toBe(404);
    await page.getByText(/could not be found/i).first().waitFor();
    await expectAccessible(page, { name: "not-found-signed-in" });
  });
});
