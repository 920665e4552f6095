// Accounts for browser tests, made and used through the public API (only the pages under test are driven
// in the browser): sign up or sign in, call the API with the session, open a page already signed in.
import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { baseUrl, type BrowserHarness } from "./browser";

export type Account = { name: string; email: string; cookies: { name: string; value: string }[] };

function cookiesOf(res: Response): Account["cookies"] {
  return res.headers.getSetCookie().map((c) => {
    const [pair] = c.split(";");
    const at = pair!.indexOf("=");
    return { name: pair!.slice(0, at), value: pair!.slice(at + 1) };
  });
}

async function authPost(path: string, body: unknown): Promise<Response> {
  return fetch(`${baseUrl}${path}`, { method: "POST", headers: { "content-type": "application/json", origin: baseUrl }, body: JSON.stringify(body) });
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

export async function pageAs(browser: BrowserHarness, account: Account, viewport?: { width: number; height: number }): Promise<Page> {
  const page = await browser.newPage(viewport);
  await page.context().addCookies(account.cookies.map((c) => ({ ...c, url: baseUrl })));
  return page;
}
