import "server-only";
import { Pool as NeonPool } from "@neondatabase/serverless";
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

function createDb(): Db {
  if (usesNeonDriver(env.DATABASE_URL, env.DB_DRIVER)) {
    const pool = new NeonPool({ connectionString: env.DATABASE_URL, max: env.DB_POOL_MAX });
    // Both drivers expose the same PgDatabase query API; the type is the node-postgres flavour.
    return drizzleNeon({ client: pool, schema }) as unknown as Db;
  }
  const pool = new Pool({ connectionString: env.DATABASE_URL, max: env.DB_POOL_MAX });
  return drizzlePg({ client: pool, schema });
}

// Survives Next's dev-mode module reloads without opening a new pool each time.
const globalForDb = globalThis as unknown as { knucklebenchDb?: Db };
export const db: Db = globalForDb.knucklebenchDb ?? createDb();
globalForDb.knucklebenchDb = db;

export { schema };
