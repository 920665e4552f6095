import "server-only";
// The comment-posting rate limit: at most COMMENT_LIMIT comments per COMMENT_WINDOW_MS for one writer (a
// member by account; a reviewer by share link and client address), else 429 with Retry-After. Counted in
// this server instance's memory (a sliding log per writer): several instances each allow the limit.
import { HttpError } from "./errors";

export const COMMENT_LIMIT = 10;
export const COMMENT_WINDOW_MS = 60_000;
const MAX_KEYS = 10_000;

const log = new Map<string, number[]>();

/** Counts one comment by `key`, or throws 429 `rate_limited` with Retry-After (whole seconds). */
export function takeCommentAllowance(key: string, now = Date.now()): void {
  const since = now - COMMENT_WINDOW_MS;
  const times = (log.get(key) ?? []).filter((t) => t > since);
  if (times.length >= COMMENT_LIMIT) {
    const retryAfterS = Math.max(1, Math.ceil((times[0]! + COMMENT_WINDOW_MS - now) / 1000));
    log.set(key, times);
    throw new HttpError(
      429,
      "rate_limited",
      `Too many comments: at most ${COMMENT_LIMIT} a minute. Try again in ${retryAfterS} s.`,
      undefined,
      { retryAfterSeconds: retryAfterS },
      { "retry-after": String(retryAfterS) },
    );
  }
  times.push(now);
  log.delete(key); // re-inserted last: the oldest writer is the first forgotten when the map is full
  if (log.size >= MAX_KEYS) log.delete(log.keys().next().value!);
  log.set(key, times);
}
