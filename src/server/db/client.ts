import "server-only";
import { Pool as NeonPool } from "@neondatabase/serverless";
import { sql } from "drizzle-orm";
import { drizzle as drizzleNeon } from "drizzle-orm/neon-serverless";
import { drizzle as drizzlePg, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "../env";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema>;

export function usesNeonDriver(url: string, driver: "auto" | "pg" | "neon"): boolean {
  if (driver !== "auto") return driver === "neon";
  try {
    return new URL(url).hostname.endsWith(".neon.tech");
  } catch {
    return false;
  }
}

/** The part of pg-pool's interface (shared by the Neon driver's Pool) that keeps a dropped connection quiet. */
type PoolEvents = {
  on(event: "error", listener: (error: Error) => void): unknown;
  on(event: "connect", listener: (client: { on(event: "error", listener: (error: Error) => void): unknown }) => void): unknown;
};

/**
 * A database restart or failover ends every open connection. pg-pool re-emits an idle connection's error on
 * the pool, and a connection that is checked out but between queries emits its own: with no listener either
 * one is an uncaughtException. The idle one is logged as one line (the pool opens a fresh connection on the
 * next query); a checked-out one is left to its next query, which fails and is answered 503.
 */
export function quietDroppedConnections(pool: PoolEvents): void {
  pool.on("error", (error) => {
    const code = (error as { code?: unknown }).code;
    console.warn(`database: an idle connection was closed (${typeof code === "string" ? `${code} ` : ""}${error.message}); the next query opens a new one`);
  });
  pool.on("connect", (client) => client.on("error", () => {}));
}

function createDb(): Db {
  const options = { connectionString: env.DATABASE_URL, max: env.DB_POOL_MAX, connectionTimeoutMillis: env.DB_CONNECT_TIMEOUT_MS };
  if (usesNeonDriver(env.DATABASE_URL, env.DB_DRIVER)) {
    const pool = new NeonPool(options);
    quietDroppedConnections(pool as unknown as PoolEvents);
    // Both drivers expose the same PgDatabase query API; the type is the node-postgres flavour.
    return drizzleNeon({ client: pool, schema }) as unknown as Db;
  }
  const pool = new Pool(options);
  quietDroppedConnections(pool);
  return drizzlePg({ client: pool, schema });
}

// Survives Next's dev-mode module reloads without opening a new pool each time.
const globalForDb = globalThis as unknown as { knucklebenchDb?: Db };
export const db: Db = globalForDb.knucklebenchDb ?? createDb();
globalForDb.knucklebenchDb = db;

/**
 * Whether the database answers `select 1` within `timeoutMs` (the readiness probe). A probe that times out
 * is abandoned, not cancelled: its connection attempt ends by itself after DB_CONNECT_TIMEOUT_MS.
 */
export async function pingDatabase(timeoutMs: number): Promise<{ ok: true; ms: number } | { ok: false; reason: string }> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<"timeout">((resolve) => {
    timer = setTimeout(() => resolve("timeout"), timeoutMs);
  });
  try {
    const outcome = await Promise.race([db.execute(sql`select 1`), timeout]);
    if (outcome === "timeout") return { ok: false, reason: `no answer within ${timeoutMs} ms` };
    return { ok: true, ms: Math.round(performance.now() - started) };
  } catch (error) {
    // The driver's own error (Drizzle wraps it as `cause`): its code, else its message, which for a
    // connection failure holds no data ("timeout exceeded when trying to connect").
    const inner = ((error as { cause?: unknown }).cause ?? error) as { code?: unknown; message?: unknown };
    const reason = typeof inner.code === "string" ? inner.code : typeof inner.message === "string" ? inner.message.slice(0, 120) : "query failed";
    return { ok: false, reason };
  } finally {
    clearTimeout(timer);
  }
}

export { schema };
