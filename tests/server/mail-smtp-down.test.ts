// With the SMTP server down, a message is kept in the outbox with its error, and sent by the retry once a
// server answers again; nothing the sender did is lost. The SMTP port here is one nothing listens on at first;
// then a real SMTP server (smtp-server, as the local catcher uses) is started on it.
import { eq, sql } from "drizzle-orm";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";
import { afterAll, describe, expect, it, vi } from "vitest";
import { db } from "@/server/db/client";
import { mailOutbox } from "@/server/db/schema";
import { deliverDueMail, resetPasswordMail, sendMail } from "@/server/mail";
import { uniqueEmail } from "../helpers/api";

const port = vi.hoisted(() => {
  // A port taken from the dynamic range and not listened on until the test starts a server there.
  const p = 40_000 + Math.floor(Math.random() * 20_000);
  process.env.KB_SMTP_HOST = "127.0.0.1";
  process.env.KB_SMTP_PORT = String(p);
  delete process.env.KB_SMTP_USER;
  delete process.env.KB_SMTP_PASSWORD;
  delete process.env.KB_MAIL_INBOX_URL;
  delete process.env.KB_MAIL_INBOX_TOKEN;
  return p;
});

let server: SMTPServer | undefined;
afterAll(() => new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve())));

describe("mail while the SMTP server is down", () => {
  it("keeps the message pending with its error, and the retry sends it once a server answers", async () => {
    const to = uniqueEmail("down");
    const first = await sendMail({ to, ...resetPasswordMail({ name: "Lior", url: "http://127.0.0.1:3100/reset-password/t" }) });
    expect(first.state).toBe("pending");
    const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, first.id));
    expect(row).toMatchObject({ status: "pending", attempts: 1, toAddress: to });
    expect(row!.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(row!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now() + 20_000); // waits before the next try

    const received: { to: string; subject: string; text: string }[] = [];
    server = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS"],
      logger: false,
      onData(stream, session, done) {
        simpleParser(stream).then((m) => {
          received.push({ to: session.envelope.rcptTo[0]!.address, subject: m.subject ?? "", text: m.text ?? "" });
          done();
        }, done);
      },
    });
    await new Promise<void>((resolve) => server!.listen(port, "127.0.0.1", resolve));
    // Not due yet: the retry leaves it alone.
    await deliverDueMail();
    const mine = () => received.filter((m) => m.to === to); // other tests' due messages may come through too
    expect(mine()).toEqual([]);
    await db.update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(eq(mailOutbox.id, first.id));
    await deliverDueMail();
    expect(mine()).toEqual([expect.objectContaining({ to, subject: "Reset your Knucklebench password" })]);
    const [after] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, first.id));
    expect(after).toMatchObject({ status: "sent", attempts: 2, lastError: null });
    // Sent once: another pass finds nothing due.
    await db.update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(eq(mailOutbox.id, first.id));
    await deliverDueMail();
    expect(mine()).toHaveLength(1);
  });
});
