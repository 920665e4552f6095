import "server-only";
import { sql } from "drizzle-orm";
import { db } from "../db/client";
import { appRateLimits } from "../db/schema";
import { HttpError } from "./errors";

// The app's own rate limits, beside better-auth's (sign-in, sign-up, password reset: src/server/auth/auth.ts).
// A fixed window per rule and subject, counted in PostgreSQL in one atomic statement, so every app instance
// shares the count. Subjects are who acts (a user id) or, for people not signed in, the client address
// (src/server/http/client-address.ts), never a raw header.

export type RateRule = { name: string; max: number; windowS: number; what: string };

/** Invitations one person may send (all workspaces together). */
export const INVITATION_RATE: RateRule = { name: "invite", max: 30, windowS: 600, what: "invitations" };
/** Comments one person may post (signed in), or one address through share links. */
export const COMMENT_RATE: RateRule = { name: "comment", max: 20, windowS: 60, what: "comments" };
/** Password reset messages sent to one account: the rest are quietly not sent (the answer never says). */
export const RESET_MAIL_RATE: RateRule = { name: "reset-mail", max: 3, windowS: 900, what: "password reset messages" };
/** Verification messages sent to one account. */
export const VERIFY_MAIL_RATE: RateRule = { name: "verify-mail", max: 5, windowS: 900, what: "confirmation messages" };

export type RateDecision = { allowed: true } | { allowed: false; retryAfterS: number };

/** Counts one use of `rule` by `subject`; says whether it is within the limit, and if not, when it will be. */
export async function consumeRate(rule: RateRule, subject: string): Promise<RateDecision> {
  const key = `${rule.name}:${subject}`;
  const window = sql`make_interval(secs => ${rule.windowS})`;
  const result = await db.execute<{ count: number; retry_after: number }>(sql`
    insert into ${appRateLimits} (key, window_start, count) values (${key}, now(), 1)
    on conflict (key) do update set
      count = case when ${appRateLimits.windowStart} <= now() - ${window} then 1 else ${appRateLimits.count} + 1 end,
      window_start = case when ${appRateLimits.windowStart} <= now() - ${window} then now() else ${appRateLimits.windowStart} end
    returning count, ceil(extract(epoch from (window_start + ${window} - now())))::int as retry_after`);
  const row = result.rows[0]!;
  if (Number(row.count) <= rule.max) return { allowed: true };
  return { allowed: false, retryAfterS: Math.max(1, Number(row.retry_after)) };
}

/** The 429 every rate limit answers: a message that says what and when, and Retry-After in seconds. */
export function tooManyRequests(what: string, retryAfterS: number): HttpError {
  const wait = retryAfterS < 90 ? `${retryAfterS} seconds` : `${Math.ceil(retryAfterS / 60)} minutes`;
  return new HttpError(429, "rate_limited", `Too many ${what} in a short time. Try again in ${wait}.`, undefined, { retryAfter: retryAfterS }, {
    "retry-after": String(retryAfterS),
  });
}

/** Counts one use and throws the 429 when over the limit. Route handlers call this before the work. */
export async function enforceRate(rule: RateRule, subject: string): Promise<void> {
  const decision = await consumeRate(rule, subject);
  if (!decision.allowed) throw tooManyRequests(rule.what, decision.retryAfterS);
}

/** For comment posting (the comments feature calls this): per person signed in, else per client address. */
export async function enforceCommentRate(subject: { userId: string } | { clientAddress: string | null }): Promise<void> {
  await enforceRate(COMMENT_RATE, "userId" in subject ? `user:${subject.userId}` : `addr:${subject.clientAddress ?? "unknown"}`);
}
