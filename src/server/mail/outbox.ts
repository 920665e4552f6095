import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq, inArray, lte, sql } from "drizzle-orm";
import { db } from "../db/client";
import { mailOutbox } from "../db/schema";
import { isDataStoreUnavailable } from "../db/unavailable";
import type { MailContent } from "./templates";
import { mailFrom, smtpTransport } from "./transport";

// Every message is written to mail_outbox before it is sent, so the action that caused it (an invitation, a
// reset request, a comment) is stored whatever the SMTP server does. The first attempt runs at once; a failed
// one is retried by the worker below with growing waits, and after the last one the row is marked failed
// (the members page shows an invitation whose message could not go out).

export type OutgoingMail = MailContent & { to: string };
export type MailState = "pending" | "sent" | "failed";

/** Waits after the 1st, 2nd, … failed attempt (seconds); the attempt after the last one is final. */
const RETRY_WAITS_S = [30, 120, 600, 1800, 3600, 3 * 3600, 6 * 3600];
/** A claimed row is left alone this long by other workers, so a slow send is not sent twice meanwhile. */
const CLAIM_S = 120;
const WORKER_EVERY_MS = 15_000;

/** Stores the message in the outbox and starts sending it; resolves once stored, with the row's id. */
export async function queueMail(mail: OutgoingMail): Promise<{ id: string }> {
  const id = await storeMail(mail);
  ensureOutboxWorker();
  void deliver(id).catch(() => {}); // its failure is recorded on the row and retried
  return { id };
}

/**
 * Stores the message and waits for the first attempt: "sent", or "pending" when it failed and will be
 * retried. For callers that tell the person at once whether the message went out.
 */
export async function sendMail(mail: OutgoingMail): Promise<{ id: string; state: MailState }> {
  const id = await storeMail(mail);
  ensureOutboxWorker();
  return { id, state: await deliver(id).catch(() => "pending" as const) };
}

async function storeMail(mail: OutgoingMail): Promise<string> {
  const id = randomUUID();
  await db.insert(mailOutbox).values({ id, toAddress: mail.to.trim().toLowerCase(), subject: mail.subject, text: mail.text, html: mail.html });
  return id;
}

/** The delivery state of outbox rows, by id. */
export async function mailStates(ids: string[]): Promise<Map<string, MailState>> {
  if (ids.length === 0) return new Map();
  const rows = await db.select({ id: mailOutbox.id, status: mailOutbox.status }).from(mailOutbox).where(inArray(mailOutbox.id, ids));
  return new Map(rows.map((r) => [r.id, r.status as MailState]));
}

/**
 * One attempt at one pending row that is due: claimed atomically (attempts + 1 and the claim time), so two
 * workers never send it at once; then sent, and marked sent, or given its next attempt time, or failed.
 */
async function deliver(id: string): Promise<MailState> {
  const [row] = await db
    .update(mailOutbox)
    .set({ attempts: sql`${mailOutbox.attempts} + 1`, nextAttemptAt: sql`now() + make_interval(secs => ${CLAIM_S})` })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, "pending"), lte(mailOutbox.nextAttemptAt, sql`now()`)))
    .returning();
  if (!row) return "pending"; // sent, claimed elsewhere or not yet due
  const transport = smtpTransport();
  try {
    if (!transport) throw new Error("no SMTP server configured (KB_SMTP_HOST)");
    await transport.sendMail({ from: mailFrom(), to: row.toAddress, subject: row.subject, text: row.text, html: row.html });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const wait = RETRY_WAITS_S[row.attempts - 1];
    const state: MailState = wait === undefined ? "failed" : "pending";
    await db
      .update(mailOutbox)
      .set({ status: state, lastError: message.slice(0, 500), nextAttemptAt: sql`now() + make_interval(secs => ${wait ?? 0})` })
      .where(eq(mailOutbox.id, id));
    // The address stays out of the log line: the row id finds it.
    console.warn(`mail: sending ${id} failed (attempt ${row.attempts}${state === "failed" ? ", giving up" : `, next in ${wait} s`}): ${message.split("\n", 1)[0]}`);
    return state;
  }
  await db.update(mailOutbox).set({ status: "sent", sentAt: sql`now()`, lastError: null }).where(eq(mailOutbox.id, id));
  return "sent";
}

/** Attempts every due pending message (at most `limit`), one after another; returns how many went out. */
export async function deliverDueMail(limit = 20): Promise<number> {
  const due = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.status, "pending"), lte(mailOutbox.nextAttemptAt, sql`now()`)))
    .orderBy(mailOutbox.nextAttemptAt)
    .limit(limit);
  let sent = 0;
  for (const { id } of due) if ((await deliver(id)) === "sent") sent++;
  return sent;
}

let worker: ReturnType<typeof setInterval> | undefined;
let running = false;

/** Starts the retry loop of this server instance once (it does not keep the process alive). */
export function ensureOutboxWorker(): void {
  if (worker) return;
  worker = setInterval(() => {
    if (running) return;
    running = true;
    deliverDueMail()
      .catch((error) => {
        if (!isDataStoreUnavailable(error)) console.warn(`mail: the outbox retry failed: ${error instanceof Error ? error.message : String(error)}`);
      })
      .finally(() => {
        running = false;
      });
  }, WORKER_EVERY_MS);
  worker.unref();
}
