import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { notFound } from "next/navigation";
import { EmptyState, ErrorNotice } from "@/components/ui/notice";
import { requireSession } from "@/server/data/guard";
import { HttpError } from "@/server/http/errors";
import { caughtMessagesTo, mailInboxEnabled, type CaughtMessage } from "@/server/mail/inbox";

export const metadata: Metadata = { title: "Sent mail (local)", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

// The demo's mailbox: what the app sent, as the local mail catcher caught it. It exists only while the app
// sends through a catcher on loopback (npm run demo, npm test); with a real provider it answers 404. Everything
// in that catcher went to the demo's invented people or to addresses tried out on this machine, so anyone
// who can open the app here may read any address's messages: that is what the page is for (reading the
// confirmation or reset link of an account one cannot sign in to yet). Signed in, it opens on one's own.

async function ownAddress(): Promise<string | null> {
  try {
    return (await requireSession(await headers())).user.email;
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) return null;
    throw error;
  }
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

/** The text part, its web addresses made links (React escapes the rest: it shows as text). */
function TextPart({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <p className="whitespace-pre-wrap break-words text-sm leading-relaxed">
      {parts.map((part, i) =>
        i % 2 === 1 ? <a key={i} href={part} className="text-steel underline">{part}</a> : <span key={i}>{part}</span>,
      )}
    </p>
  );
}

function Message({ message }: { message: CaughtMessage }) {
  return (
    <article className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby={`m-${message.id}`}>
      <h2 id={`m-${message.id}`} className="font-semibold">{message.subject || "(no subject)"}</h2>
      <p className="mb-3 text-xs text-ink-muted">
        From {message.from} to {message.to.join(", ")} · {dateFormat.format(new Date(message.date))} UTC
      </p>
      <TextPart text={message.text} />
      {message.html ? (
        <details className="mt-3 text-sm">
          <summary className="cursor-pointer text-steel">The HTML part as it is shown</summary>
          {/* No scripts, no forms, no navigation: the part is shown exactly as a mail client would show it. */}
          <iframe title={`HTML part of “${message.subject}”`} sandbox="" srcDoc={message.html} className="mt-2 h-96 w-full rounded border border-ink/10 bg-white" />
        </details>
      ) : null}
    </article>
  );
}

export default async function MailPage({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  if (!mailInboxEnabled()) notFound();
  const { to } = await searchParams;
  const address = (to ?? (await ownAddress()) ?? "").trim().toLowerCase();
  let messages: CaughtMessage[] = [];
  let failure: string | null = null;
  if (address) {
    try {
      messages = await caughtMessagesTo(address);
    } catch {
      failure = "The local mail catcher did not answer. Is npm run demo still running?";
    }
  }
  return (
    <main className="mx-auto max-w-3xl px-6 py-10">
      <p className="text-sm"><Link href="/" className="text-steel hover:underline">Knucklebench</Link></p>
      <h1 className="mt-2 text-2xl font-semibold tracking-tight text-steel">Sent mail</h1>
      <p className="mt-2 text-sm text-ink-muted">
        The messages this app sent, as the local mail catcher received them: nothing here left this machine. This page exists
        only in development and the demo; with a real mail provider it is off.
      </p>
      <form method="get" className="mt-4 flex flex-wrap items-end gap-2" aria-label="Choose a mailbox">
        <label className="flex flex-col gap-1 text-sm font-medium" htmlFor="to">
          Address
          <input id="to" name="to" type="email" defaultValue={address} required className="w-72 rounded border border-ink/30 px-2 py-1.5 font-normal" />
        </label>
        <button type="submit" className="rounded bg-steel px-3 py-1.5 text-sm font-medium text-white">Show messages</button>
      </form>
      <div className="mt-6 flex flex-col gap-4">
        {failure ? (
          <ErrorNotice title="Could not read the mail" message={failure} />
        ) : !address ? (
          <EmptyState title="Choose an address">Give an address to read the messages sent to it, or sign in to read your own.</EmptyState>
        ) : messages.length === 0 ? (
          <EmptyState title="No messages">Nothing was sent to {address} yet.</EmptyState>
        ) : (
          <>
            <p className="text-sm" role="status">{messages.length === 1 ? "1 message" : `${messages.length} messages`} to {address}, newest first.</p>
            {messages.map((m) => <Message key={m.id} message={m} />)}
          </>
        )}
      </div>
    </main>
  );
}
