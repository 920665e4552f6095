import { EventEmitter } from "node:events";
import { Pool as NeonPool } from "@neondatabase/serverless";
import { Pool } from "pg";
import { describe, expect, it, vi } from "vitest";
import { quietDroppedConnections, usesNeonDriver } from "@/server/db/client";

describe("database driver choice", () => {
  it("auto picks the Neon serverless driver for a hosted Neon URL and node-postgres otherwise", () => {
    expect(usesNeonDriver("postgres://u:p@ep-quiet-field-123456.eu-central-1.aws.neon.tech/app?sslmode=require", "auto")).toBe(true);
    expect(usesNeonDriver("postgres://knucklebench@127.0.0.1:54329/knucklebench", "auto")).toBe(false);
    expect(usesNeonDriver("not a url", "auto")).toBe(false);
  });
  it("an explicit DB_DRIVER wins", () => {
    expect(usesNeonDriver("postgres://127.0.0.1/x", "neon")).toBe(true);
    expect(usesNeonDriver("postgres://u@ep-x.neon.tech/x", "pg")).toBe(false);
  });
});

describe("a connection the database dropped", () => {
  // What PostgreSQL sends each connection on a fast shutdown (SQLSTATE 57P01).
  const adminShutdown = () => Object.assign(new Error("terminating connection due to administrator command"), { code: "57P01" });

  it.each([
    ["node-postgres", () => new Pool({ connectionString: "postgres://u:p@127.0.0.1:1/x" })],
    ["Neon serverless", () => new NeonPool({ connectionString: "postgres://u:p@ep-x.neon.tech/x" })],
  ])("is one warning line on the %s pool when idle, and no exception when checked out", (_name, makePool) => {
    const pool = makePool();
    // Without a listener an EventEmitter throws its 'error': the uncaughtException the pools used to raise.
    expect(() => pool.emit("error", adminShutdown())).toThrow("administrator command");

    quietDroppedConnections(pool as unknown as Parameters<typeof quietDroppedConnections>[0]);
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    expect(() => pool.emit("error", adminShutdown())).not.toThrow();
    expect(warn.mock.calls).toEqual([
      ["database: an idle connection was closed (57P01 terminating connection due to administrator command); the next query opens a new one"],
    ]);
    const client = new EventEmitter();
    pool.emit("connect", client);
    expect(() => client.emit("error", new Error("Connection terminated unexpectedly"))).not.toThrow();
    expect(warn).toHaveBeenCalledTimes(1); // its next query fails instead, and is answered 503
    warn.mockRestore();
  });
});
