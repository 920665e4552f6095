import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();

describe("a new designer", () => {
  it("signs up, lands in a personal workspace, creates and renames a kit, and is sent to sign-in after signing out", async () => {
    const page = await browser.newPage();
    const email = `lena-${randomUUID().slice(0, 8)}@test.example`;

    await page.goto("/sign-up");
    await page.getByLabel("Name").fill("Lena Voss");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("steer-lock-42");
    await page.getByRole("button", { name: "Create account" }).click();

    await page.waitForURL(/\/workspaces\/[^/]+\/kits$/);
    const selected = await page.getByRole("combobox", { name: "Workspace" }).locator("option:checked").textContent();
    expect(selected).toBe("Lena's workspace");
    await page.getByText("No kits yet").waitFor();

    await page.getByTestId("new-kit").click();
    await page.getByLabel("Name").fill("Sandpiper front corner");
    await page.getByRole("button", { name: "Create kit" }).click();
    const list = page.getByRole("table", { name: "Kits" });
    await list.getByText("Sandpiper front corner").waitFor();

    await page.getByRole("button", { name: "Rename Sandpiper front corner" }).click();
    const rename = page.getByLabel("New name");
    await rename.fill("Sandpiper front corner, 4 mm neck");
    await rename.press("Enter");
    await list.getByText("Sandpiper front corner, 4 mm neck").waitFor();

    await page.reload();
    await page.getByRole("table", { name: "Kits" }).getByText("Sandpiper front corner, 4 mm neck").waitFor();
    expect(await page.getByTestId("kit-name").allTextContents()).toEqual(["Sandpiper front corner, 4 mm neck"]);

    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto("/kits");
    await page.waitForURL(/\/sign-in\?next=%2Fkits/);
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
  });

  it("sees a clear message for a wrong password", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill("nobody-here@test.example");
    await page.getByLabel("Password").fill("wrong-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("alert").getByText("Could not sign in").waitFor();
    expect(page.url()).toMatch(/\/sign-in/);
  });
});

describe("a kit's analysis sheet", () => {
  it("shows steer lock, what limits it and the shaft safety factor for a new kit's starting layout", async () => {
    const page = await browser.newPage();
    await page.goto("/sign-up");
    await page.getByLabel("Name").fill("Orla Brandt");
    await page.getByLabel("E-mail").fill(`orla-${randomUUID().slice(0, 8)}@test.example`);
    await page.getByLabel("Password").fill("steer-lock-42");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/workspaces\/[^/]+\/kits$/);
    await page.getByTestId("new-kit").click();
    await page.getByLabel("Name").fill("Heron corner");
    await page.getByRole("button", { name: "Create kit" }).click();
    await page.getByRole("link", { name: "Heron corner" }).click();
    await page.waitForURL(/\/kits\/[0-9a-f-]{36}$/);
    // A new kit opens in the editor on the baseline corner; the full sheet is one of its tabs.
    await page.getByTestId("steer-lock-worst").waitFor();
    await page.getByTestId("tab-sheet").click();

    const lock = page.getByRole("region", { name: "Steer lock" });
    await lock.getByText("Limited by").waitFor();
    const lockText = await lock.innerText();
    expect(lockText).toMatch(/\d+\.\d°/);
    expect(lockText).not.toMatch(/NaN|Infinity|undefined/);
    const strength = page.getByRole("region", { name: "Shaft strength at the neck" });
    expect(await strength.innerText()).toMatch(/Safety factor\s+\d+\.\d\d/);
    await page.getByRole("table", { name: "Neck diameter what-if" }).waitFor();
    await page.getByText("Cautions").first().waitFor();
  });
});
