// Telling "the database cannot be reached" from every other database error: the first is an outage the
// caller may retry (503), the others are bugs or refusals. Pure, so the route wrapper, the pages and the
// readiness probe classify alike.

/**
 * SQLSTATEs that mean the server is going away or not taking connections: class 08 (connection exception),
 * 57P01 admin_shutdown (a fast stop or restart), 57P02 crash_shutdown, 57P03 cannot_connect_now (starting
 * up, shutting down, in recovery), 53300 too_many_connections. PostgreSQL documentation, Appendix A
 * "PostgreSQL Error Codes".
 */
const UNAVAILABLE_SQLSTATES = new Set(["57P01", "57P02", "57P03", "53300"]);

/** Node's socket errors for a server that is down, restarting or unreachable (Node.js "Common system errors"). */
const UNAVAILABLE_SYSTEM_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ECONNABORTED",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "EAI_AGAIN",
]);

/**
 * What node-postgres and pg-pool say when a connection ends or cannot be made in time; they carry no code.
 * (The Neon driver is pg-based and says the same over its WebSocket.)
 */
const UNAVAILABLE_MESSAGES = [
  /^Connection terminated/, // "… unexpectedly", "… due to connection timeout"
  /^timeout exceeded when trying to connect$/,
  /^Client has encountered a connection error and is not queryable$/,
  /^Client was closed and is not queryable$/,
];

function ownIsUnavailable(error: object): boolean {
  const code = (error as { code?: unknown }).code;
  if (typeof code === "string") {
    if (code.startsWith("08") && code.length === 5) return true;
    if (UNAVAILABLE_SQLSTATES.has(code) || UNAVAILABLE_SYSTEM_CODES.has(code)) return true;
  }
  const message = (error as { message?: unknown }).message;
  return typeof message === "string" && UNAVAILABLE_MESSAGES.some((m) => m.test(message));
}

/**
 * True when `error`, or anything it wraps (Drizzle's failed-query error keeps the driver's as `cause`;
 * a connection to a name with several addresses fails with an AggregateError of each), says the database
 * could not be reached or dropped the connection.
 */
export function isDataStoreUnavailable(error: unknown): boolean {
  const seen = new Set<unknown>();
  const queue: unknown[] = [error];
  while (queue.length > 0 && seen.size < 16) {
    const current = queue.shift();
    if (current === null || typeof current !== "object" || seen.has(current)) continue;
    seen.add(current);
    if (ownIsUnavailable(current)) return true;
    queue.push((current as { cause?: unknown }).cause);
    const inner = (current as { errors?: unknown }).errors;
    if (Array.isArray(inner)) queue.push(...inner);
  }
  return false;
}
