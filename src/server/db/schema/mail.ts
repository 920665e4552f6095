import { sql } from "drizzle-orm";
import { check, index, integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

// Every e-mail the app sends goes through this outbox (src/server/mail/outbox.ts): the row is written first,
// in the same breath as the action that causes it, then sent; a failed send is retried from here, so an SMTP
// outage never loses the invitation, the reset or the notice, and never fails the request that made it.
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: text("id").primaryKey(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    // pending (waiting for its next attempt), sent, failed (gave up after the last attempt)
    status: text("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [
    check("mail_outbox_status", sql`${t.status} in ('pending', 'sent', 'failed')`),
    index("mail_outbox_due_idx").on(t.nextAttemptAt).where(sql`${t.status} = 'pending'`),
  ],
);

// Fixed-window counters of the app's own rate limits (src/server/http/rate-limit.ts): invitations sent,
// comments posted. One row per rule and subject; the window restarts when it has passed.
export const appRateLimits = pgTable("app_rate_limits", {
  key: text("key").primaryKey(),
  windowStart: timestamp("window_start", { withTimezone: true }).notNull().defaultNow(),
  count: integer("count").notNull().default(0),
});
