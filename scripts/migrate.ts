// Applies the committed migrations in drizzle/ to DATABASE_URL. Never `drizzle-kit push` in the start path.
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import { backfillSummaries } from "./lib/backfill-summaries";

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("migrate: DATABASE_URL is not set");
  process.exit(1);
}
const pool = new Pool({ connectionString: url, max: 1 });
try {
  await migrate(drizzle({ client: pool }), { migrationsFolder: new URL("../drizzle", import.meta.url).pathname });
  const filled = await backfillSummaries(pool);
  if (filled > 0) console.log(`migrate: computed the summary of ${filled} revision(s)`);
  console.log("migrate: database is up to date");
} catch (error) {
  console.error("migrate: failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await pool.end();
}
