import { defineConfig } from "drizzle-kit";

// Only `drizzle-kit generate` reads this: migrations are applied by scripts/migrate.ts.
export default defineConfig({
  dialect: "postgresql",
  schema: "./src/server/db/schema/index.ts",
  out: "./drizzle",
  dbCredentials: { url: process.env.DATABASE_URL ?? "postgres://knucklebench@127.0.0.1:54329/knucklebench" },
});
