// Which errors mean "the database cannot be reached" (503, retry) and which are anything else (a bug: 500).
// SQLSTATEs from the PostgreSQL documentation, Appendix A "PostgreSQL Error Codes"; system codes from
// Node.js's "Common system errors"; the messages are node-postgres's and pg-pool's own.
import { describe, expect, it } from "vitest";
import { isDataStoreUnavailable } from "@/server/db/unavailable";

const withCode = (code: string, message = "x") => Object.assign(new Error(message), { code });
/** As Drizzle reports a failed query: its own error, the driver's as the cause. */
const drizzleWrapped = (cause: unknown) => new Error("Failed query: select 1\nparams: ", { cause });

describe("isDataStoreUnavailable", () => {
  it.each([
    ["57P01 admin_shutdown (fast stop, restart)", withCode("57P01", "terminating connection due to administrator command")],
    ["57P02 crash_shutdown", withCode("57P02")],
    ["57P03 cannot_connect_now (starting up)", withCode("57P03", "the database system is starting up")],
    ["53300 too_many_connections", withCode("53300")],
    ["08006 connection_failure", withCode("08006")],
    ["08001 sqlclient_unable_to_establish_sqlconnection", withCode("08001")],
    ["ECONNREFUSED", withCode("ECONNREFUSED", "connect ECONNREFUSED 127.0.0.1:5432")],
    ["ECONNRESET", withCode("ECONNRESET")],
    ["ETIMEDOUT", withCode("ETIMEDOUT")],
    ["EHOSTUNREACH", withCode("EHOSTUNREACH")],
    ["node-postgres: connection ended", new Error("Connection terminated unexpectedly")],
    ["node-postgres: connect timeout", new Error("Connection terminated due to connection timeout")],
    ["pg-pool: connect timeout", new Error("timeout exceeded when trying to connect")],
    ["node-postgres: a client whose connection failed", new Error("Client has encountered a connection error and is not queryable")],
    ["wrapped by Drizzle", drizzleWrapped(withCode("ECONNREFUSED"))],
    ["wrapped twice (better-auth's APIError around Drizzle's)", new Error("Failed to get session", { cause: drizzleWrapped(withCode("57P01")) })],
    ["an AggregateError of each address tried", Object.assign(new AggregateError([withCode("ECONNREFUSED"), withCode("ECONNREFUSED")], ""), { code: "ECONNREFUSED" })],
    ["an AggregateError without a code of its own", new AggregateError([new Error("other"), withCode("ENETUNREACH")], "")],
  ])("%s: unavailable", (_name, error) => {
    expect(isDataStoreUnavailable(error)).toBe(true);
  });

  it.each([
    ["23505 unique_violation", withCode("23505", "duplicate key value violates unique constraint")],
    ["22P02 invalid_text_representation", withCode("22P02")],
    ["42P01 undefined_table (a missing migration is a bug, not an outage)", withCode("42P01", 'relation "kits" does not exist')],
    ["57014 query_canceled (a statement timeout)", withCode("57014")],
    ["28P01 invalid_password (configuration, retrying will not help)", withCode("28P01")],
    ["a plain error", new Error("boom")],
    ["Drizzle around a constraint error", drizzleWrapped(withCode("23503"))],
    ["not an error", "ECONNREFUSED"],
    ["nothing", undefined],
  ])("%s: not unavailable", (_name, error) => {
    expect(isDataStoreUnavailable(error)).toBe(false);
  });

  it("a cause chain that loops ends", () => {
    const a = new Error("a") as Error & { cause?: unknown };
    const b = new Error("b", { cause: a });
    a.cause = b;
    expect(isDataStoreUnavailable(a)).toBe(false);
  });
});
