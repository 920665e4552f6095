// The e-mail flows in the browser, with the real messages read on the app's sent-mail page (which reads the
// local mail catcher npm test started): confirming the address after sign-up, resetting a password, and an
// invitation accepted by a newcomer who signs up through its link and lands with the invited role; its
// second use is refused. Markup in the workspace's name shows as text. Each page is checked with axe.
import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { expectAccessible } from "./helpers/a11y";
import { apiAs, pageAs, signUpByApi } from "./helpers/accounts";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();
const email = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@test.example`;

/** Opens the sent-mail page for `address` and waits for a message whose subject matches. */
async function openMail(page: Page, address: string, subject: RegExp): Promise<void> {
  for (let i = 0; i < 20; i++) {
    await page.goto(`/mail?to=${encodeURIComponent(address)}`);
    await page.getByRole("heading", { name: "Sent mail", level: 1 }).waitFor();
    if ((await page.getByRole("heading", { name: subject, level: 2 }).count()) > 0) return;
    await page.waitForTimeout(250);
  }
  throw new Error(`no message ${subject} to ${address} on the mail page`);
}

describe("e-mail in the browser", () => {
  it("a new account confirms its address by the link in its message", async () => {
    const page = await browser.newPage();
    const address = email("wren");
    await page.goto("/sign-up");
    await page.getByLabel("Name").fill("Wren Abara");
    await page.getByLabel("E-mail").fill(address);
    await page.getByLabel("Password").fill("steer-lock-42");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/workspaces\/[^/]+\/kits$/);

    // Signed in, the mail page opens on one's own address.
    await page.goto("/mail");
    await page.getByRole("heading", { name: "Confirm your e-mail address for Knucklebench", level: 2 }).waitFor();
    expect(await page.getByRole("textbox", { name: "Address" }).inputValue()).toBe(address);
    await expectAccessible(page, { name: "mail-with-messages" });
    const before = await page.request.get("/api/auth/get-session");
    expect(((await before.json()) as { user: { emailVerified: boolean } }).user.emailVerified).toBe(false);

    await page.getByRole("link", { name: /\/api\/auth\/verify-email\?/ }).click();
    await page.waitForURL(/\/workspaces\/[^/]+\/kits$/);
    const after = await page.request.get("/api/auth/get-session");
    expect(((await after.json()) as { user: { emailVerified: boolean } }).user.emailVerified).toBe(true);
  });

  it("a forgotten password is reset through the mailed link, and the new one signs in", async () => {
    const account = await signUpByApi("Ansel Kerr");
    const page = await browser.newPage();
    await page.goto("/sign-in");
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.getByRole("heading", { name: "Reset your password" }).waitFor();
    await expectAccessible(page, { name: "forgot-password" });
    await page.getByLabel("E-mail").fill(account.email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await page.getByRole("heading", { name: "Check your e-mail" }).waitFor();

    await openMail(page, account.email, /Reset your Knucklebench password/);
    await page.getByRole("link", { name: /\/api\/auth\/reset-password\// }).click();
    await page.waitForURL(/\/reset-password\?token=/);
    await page.getByRole("heading", { name: "Choose a new password" }).waitFor();
    await page.getByLabel("New password", { exact: true }).fill("new-steer-lock-7");
    await page.getByLabel("New password again").fill("new-steer-lock-8");
    await page.getByRole("button", { name: "Change the password" }).click();
    await page.locator("#repeat-error").getByText("The two passwords differ").waitFor();
    await expectAccessible(page, { name: "reset-password-errors" });
    await page.getByLabel("New password again").fill("new-steer-lock-7");
    await page.getByRole("button", { name: "Change the password" }).click();
    await page.getByRole("heading", { name: "Password changed" }).waitFor();

    await page.getByRole("link", { name: "Sign in" }).click();
    await page.getByLabel("E-mail").fill(account.email);
    await page.getByLabel("Password").fill("steer-lock-42");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("alert").getByText("Could not sign in").waitFor();
    await page.getByLabel("Password").fill("new-steer-lock-7");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/workspaces\/[^/]+\/kits$/);
  });

  it("an invitation reaches a newcomer, who signs up through its link and lands with the invited role; a second use is refused", async () => {
    const owner = await signUpByApi("Oriane Falk");
    const name = `<script>alert(1)</script> Dune <b>Club</b>`;
    const { workspace } = await apiAs<{ workspace: { id: string } }>(owner, "/api/workspaces", { method: "POST", body: { name } });
    const invitee = email("sacha");

    const ownerPage = await pageAs(browser, owner);
    await ownerPage.goto(`/workspaces/${workspace.id}/members`);
    await ownerPage.getByLabel("E-mail").fill(invitee);
    await ownerPage.getByLabel("Role").selectOption("editor");
    await ownerPage.getByRole("button", { name: "Invite" }).click();
    const pending = ownerPage.getByRole("list", { name: "Pending invitations" });
    await pending.getByText(invitee).waitFor();
    // The list looks again by itself while a message is on its way.
    await pending.getByText("Message sent").waitFor({ timeout: 15_000 });
    await expectAccessible(ownerPage, { name: "members-invitation-sent" });

    const page = await browser.newPage();
    await openMail(page, invitee, /invited you to/);
    // The name's markup is text on the page (and in the HTML part, which the page shows sandboxed).
    await page.getByRole("heading", { name: `Oriane Falk invited you to ${name} on Knucklebench` }).waitFor();
    expect(await page.locator("main b").count()).toBe(0);
    await page.getByRole("link", { name: /\/invitations\// }).click();
    await page.getByRole("heading", { name: `Join ${name}` }).waitFor();
    await expectAccessible(page, { name: "invitation-signed-out" });
    const link = page.url();

    await page.getByRole("link", { name: "Create an account" }).click();
    await page.getByLabel("Name").fill("Sacha Vidal");
    await page.getByLabel("E-mail").fill(invitee);
    await page.getByLabel("Password").fill("steer-lock-42");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(/\/invitations\//);
    await page.getByRole("button", { name: "Accept and join" }).click();
    await page.waitForURL(new RegExp(`/workspaces/${workspace.id}/members$`));
    const me = page.getByRole("row").filter({ hasText: invitee });
    await me.getByText("editor").waitFor();

    // The same link again: refused, whoever opens it.
    await page.goto(link);
    await page.getByRole("heading", { name: "This invitation does not work" }).waitFor();
    await page.getByText("It was already used: an invitation works once.").waitFor();
    await expectAccessible(page, { name: "invitation-used" });
  });

  it("the mail page with no messages for an address", async () => {
    const page = await browser.newPage();
    await page.goto(`/mail?to=${encodeURIComponent(email("nobody"))}`);
    await page.getByText("No messages", { exact: true }).waitFor();
    await expectAccessible(page, { name: "mail-empty" });
  });
});
