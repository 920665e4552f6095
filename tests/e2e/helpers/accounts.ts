// Accounts for browser tests, made and used through the public API (only the pages under test are driven
// in the browser): sign up or sign in, call the API with the session, open a page already signed in.
import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { linkIn, waitForMail } from "../../helpers/mail";
import { baseUrl, randomClientIp, type BrowserHarness } from "./browser";

export type Account = { name: string; email: string; cookies: { name: string; value: string }[] };

function cookiesOf(res: Response): Account["cookies"] {
  return res.headers.getSetCookie().map((c) => {
    const [pair] = c.split(";");
    const at = pair!.indexOf("=");
    return { name: pair!.slice(0, at), value: pair!.slice(at + 1) };
  });
}

/** A POST to an auth route from a client address of its own (the test app trusts one proxy hop). */
export async function authPost(path: string, body: unknown): Promise<Response> {
  return fetch(`${baseUrl}${path}`, { method: "POST", headers: { "content-type": "application/json", origin: baseUrl, "x-forwarded-for": randomClientIp() }, body: JSON.stringify(body) });
}

export async function signUpByApi(name: string, password = "steer-lock-42"): Promise<Account> {
  const email = `${name.split(" ")[0]!.toLowerCase()}-${randomUUID().slice(0, 8)}@test.example`;
  const res = await authPost("/api/auth/sign-up/email", { name, email, password });
  if (res.status !== 200) throw new Error(`sign-up of ${email} failed: ${res.status} ${await res.text()}`);
  return { name, email, cookies: cookiesOf(res) };
}

export async function signInByApi(email: string, password: string): Promise<Account> {
  const res = await authPost("/api/auth/sign-in/email", { email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  const body = (await res.json()) as { user: { name: string } };
  return { name: body.user.name, email, cookies: cookiesOf(res) };
}

export async function apiAs<T>(account: Account, path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, {
    method: init.method ?? "GET",
    headers: {
      cookie: account.cookies.map((c) => `${c.name}=${c.value}`).join("; "),
      origin: baseUrl,
      ...(init.body === undefined ? {} : { "content-type": "application/json" }),
    },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (!res.ok) throw new Error(`${init.method ?? "GET"} ${path} answered ${res.status}: ${await res.text()}`);
  return (res.status === 204 ? undefined : await res.json()) as T;
}

/** Makes `account` a member the way a person joins: `owner` invites the address, the invitee accepts. */
export async function addMemberByInvitation(owner: Account, workspaceId: string, account: Account, role: string): Promise<void> {
  await apiAs(owner, `/api/workspaces/${workspaceId}/members`, { method: "POST", body: { email: account.email, role } });
  const { invitations } = await apiAs<{ invitations: { id: string; workspace: { id: string } }[] }>(account, "/api/me/invitations");
  const invitation = invitations.find((i) => i.workspace.id === workspaceId);
  if (!invitation) throw new Error(`no open invitation for ${account.email} to ${workspaceId}`);
  // Accepting from the list needs a confirmed address: the message's link, followed as a person would.
  await confirmByMail(account);
  await apiAs(account, `/api/me/invitations/${invitation.id}/accept`, { method: "POST" });
}

/** Follows the confirmation link of the sign-up message in the local mail catcher (once per account). */
export async function confirmByMail(account: Account): Promise<void> {
  if (confirmed.has(account.email)) return;
  const mail = await waitForMail(account.email, /Confirm your e-mail address/);
  const res = await fetch(linkIn(mail, `${baseUrl}/api/auth/verify-email?`), { redirect: "manual", headers: { "x-forwarded-for": randomClientIp() } });
  if (res.status !== 302) throw new Error(`confirming ${account.email} answered ${res.status}`);
  confirmed.add(account.email);
}
const confirmed = new Set<string>();

export async function pageAs(browser: BrowserHarness, account: Account, viewport?: { width: number; height: number }): Promise<Page> {
  const page = await browser.newPage(viewport);
  await page.context().addCookies(account.cookies.map((c) => ({ ...c, url: baseUrl })));
  return page;
}
