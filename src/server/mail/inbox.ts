import "server-only";
import { z } from "zod";
import { env } from "../env";

// Reads the local mail catcher (scripts/lib/mail-catcher-server.mjs) for the mail page. Only configured with
// a catcher on loopback (src/server/env.ts refuses anything else), so with a real provider the page is off.

const caughtMessage = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
});
export type CaughtMessage = z.infer<typeof caughtMessage>;

export function mailInboxEnabled(): boolean {
  return Boolean(env.KB_MAIL_INBOX_URL && env.KB_MAIL_INBOX_TOKEN);
}

/** The caught messages addressed to `address`, newest first (at most `limit`). */
export async function caughtMessagesTo(address: string, limit = 50): Promise<CaughtMessage[]> {
  if (!mailInboxEnabled()) return [];
  const url = new URL("/messages", env.KB_MAIL_INBOX_URL);
  url.searchParams.set("to", address.trim().toLowerCase());
  const res = await fetch(url, { headers: { authorization: `Bearer ${env.KB_MAIL_INBOX_TOKEN}` }, cache: "no-store", signal: AbortSignal.timeout(5_000) });
  if (!res.ok) throw new Error(`the mail catcher answered ${res.status}`);
  const body = z.object({ messages: z.array(caughtMessage) }).parse(await res.json());
  return body.messages.slice(0, limit);
}
