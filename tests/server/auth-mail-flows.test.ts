// Sign-up confirmation and password reset, end to end through the real local mail catcher: the message is
// read back from it, its link followed through better-auth's own handlers. And their rate limits: 429 with
// Retry-After. Every request here carries its own client address, so no test pools with another.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as authGet, POST as authPost } from "@/app/api/auth/[...all]/route";
import { db } from "@/server/db/client";
import { users } from "@/server/db/schema";
import { BASE, fromAddress, randomClientIp, signIn, signUp, uniqueEmail } from "../helpers/api";
import { linkIn, messagesTo, waitForMail } from "../helpers/mail";

const origin = new URL(BASE).origin;
const post = (path: string, body: unknown, ip = randomClientIp()) =>
  authPost(new Request(`${BASE}/api/auth${path}`, { method: "POST", headers: { "content-type": "application/json", origin, ...fromAddress(ip) }, body: JSON.stringify(body) }));
const get = (url: string, headers: Record<string, string> = {}) => authGet(new Request(url, { headers: { ...fromAddress(randomClientIp()), ...headers } }));

describe("address confirmation at sign-up", () => {
  it("sends a link on the public origin; following it confirms the address and signs in", async () => {
    const person = await signUp("Wren <b>Halloran</b>");
    const [before] = await db.select({ v: users.emailVerified }).from(users).where(eq(users.id, person.userId));
    expect(before!.v).toBe(false);

    const mail = await waitForMail(person.email, /Confirm your e-mail address/);
    expect(mail.text).toContain("Hello Wren <b>Halloran</b>,");
    expect(mail.html).toContain("Hello Wren &lt;b&gt;Halloran&lt;/b&gt;,");
    const link = linkIn(mail, `${BASE}/api/auth/verify-email?`);
    expect(new URL(link).searchParams.get("callbackURL")).toBe("/");

    const res = await get(link);
    expect(res.status).toBe(302);
    expect(res.headers.get("location")).toBe("/");
    expect(res.headers.getSetCookie().some((c) => c.startsWith("better-auth.session_token="))).toBe(true);
    const [after] = await db.select({ v: users.emailVerified }).from(users).where(eq(users.id, person.userId));
    expect(after!.v).toBe(true);

    // The link works once: a second use changes nothing and signs nobody in.
    const again = await get(link);
    expect(again.headers.getSetCookie().some((c) => c.startsWith("better-auth.session_token=") && !c.includes("Max-Age=0"))).toBe(false);
  });
});

describe("password reset", () => {
  it("mails a link; the new password signs in, the old one no longer does", async () => {
    const person = await signUp("Ansel Marchetti");
    const asked = await post("/request-password-reset", { email: person.email, redirectTo: "/reset-password" });
    expect(asked.status).toBe(200);
    const mail = await waitForMail(person.email, /Reset your Knucklebench password/);
    const link = linkIn(mail, `${BASE}/api/auth/reset-password/`);

    // better-auth's link checks the token and hands it to the app's page.
    const landed = await get(link);
    expect(landed.status).toBe(302);
    const page = new URL(landed.headers.get("location")!, BASE);
    expect(page.pathname).toBe("/reset-password");
    const token = page.searchParams.get("token");
    expect(token).toBeTruthy();

    const reset = await post("/reset-password", { token, newPassword: "a-new-bench-pass-7" });
    expect(reset.status).toBe(200);
    expect((await signIn(person.email, person.password)).status).toBe(401);
    expect((await signIn(person.email, "a-new-bench-pass-7")).status).toBe(200);
    // The token works once.
    expect((await post("/reset-password", { token, newPassword: "yet-another-pass-8" })).status).toBe(400);
  });

  it("answers an unknown address the same, and mails nobody", async () => {
    const nobody = uniqueEmail("nobody");
    const res = await post("/request-password-reset", { email: nobody, redirectTo: "/reset-password" });
    expect(res.status).toBe(200);
    await new Promise((r) => setTimeout(r, 300));
    expect(await messagesTo(nobody)).toEqual([]);
  });

  it("limits reset requests from one address: 429 with Retry-After and a clear message", async () => {
    const ip = randomClientIp();
    const statuses: number[] = [];
    let last: Response | undefined;
    for (let i = 0; i < 7; i++) {
      last = await post("/request-password-reset", { email: uniqueEmail("flood"), redirectTo: "/reset-password" }, ip);
      statuses.push(last.status);
    }
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429, 429]);
    const retryAfter = Number(last!.headers.get("retry-after"));
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(60);
    const body = (await last!.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toMatch(/^Too many password reset requests in a short time\. Try again in \d+ seconds\.$/);
  });

  it("sends one account at most three reset messages in 15 minutes, whoever asks", async () => {
    const person = await signUp("Maelle Brandt");
    for (let i = 0; i < 5; i++) expect((await post("/request-password-reset", { email: person.email, redirectTo: "/reset-password" })).status).toBe(200);
    await waitForMail(person.email, /Reset your/, { count: 3 });
    await new Promise((r) => setTimeout(r, 500));
    expect((await messagesTo(person.email)).filter((m) => /Reset your/.test(m.subject))).toHaveLength(3);
  });
});

describe("sign-up rate limit", () => {
  it("answers the 11th sign-up a minute from one address with 429 and Retry-After", async () => {
    const ip = randomClientIp();
    const statuses: number[] = [];
    let last: Response | undefined;
    for (let i = 0; i < 11; i++) {
      last = await post("/sign-up/email", { name: "Flood", email: uniqueEmail("signupflood"), password: "correct-horse-9" }, ip);
      statuses.push(last.status);
    }
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(200));
    expect(statuses[10]).toBe(429);
    expect(Number(last!.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await last!.json()) as { error: { message: string } }).error.message).toMatch(/^Too many sign-up attempts/);
  });
});
