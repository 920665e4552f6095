// Reads the real messages the app sent, from the local mail catcher npm test starts (scripts/lib/mail-catcher.sh).
import { expect } from "vitest";

export type CaughtMail = { id: string; from: string; to: string[]; subject: string; text: string; html: string; date: string };

function inbox(): { url: string; token: string } {
  const url = process.env.KB_MAIL_INBOX_URL;
  const token = process.env.KB_MAIL_INBOX_TOKEN;
  if (!url || !token) throw new Error("KB_MAIL_INBOX_URL is not set: run the tests through npm test (or start the local mail catcher)");
  return { url, token };
}

export async function messagesTo(address: string): Promise<CaughtMail[]> {
  const { url, token } = inbox();
  const res = await fetch(`${url}/messages?to=${encodeURIComponent(address.toLowerCase())}`, { headers: { authorization: `Bearer ${token}` } });
  expect(res.status).toBe(200);
  return ((await res.json()) as { messages: CaughtMail[] }).messages;
}

/** Waits (up to `timeoutMs`) for the `count`-th message to `address` whose subject matches, and returns the newest. */
export async function waitForMail(address: string, subject: RegExp, { count = 1, timeoutMs = 10_000 } = {}): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await messagesTo(address)).filter((m) => subject.test(m.subject));
    if (found.length >= count) return found[0]!;
    if (Date.now() > deadline) throw new Error(`no message "${subject}" to ${address} within ${timeoutMs} ms (found ${found.length}, wanted ${count})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The one link in the message's text part that starts with `prefix` (an absolute URL on the app's origin). */
export function linkIn(mail: CaughtMail, prefix: string): string {
  const links = (mail.text.match(/https?:\/\/\S+/g) ?? []).filter((l) => l.startsWith(prefix));
  expect(links.length, `a link starting ${prefix} in:\n${mail.text}`).toBeGreaterThan(0);
  return links[0]!;
}
