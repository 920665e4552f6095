// A PostgreSQL cluster of a test's own, started, stopped and restarted with the project's scripts
// (scripts/lib/pg.sh: as the `postgres` user when root), so a test can take its database away and bring it
// back without touching the database the other tests share.
import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { fileURLToPath } from "node:url";

const run = promisify(execFile);
const root = fileURLToPath(new URL("../..", import.meta.url));

async function bash(script: string): Promise<string> {
  // DATABASE_URL unset: kb_pg_start would otherwise use that database instead of starting one.
  const env = { ...process.env };
  delete env.DATABASE_URL;
  const { stdout } = await run("bash", ["-c", `set -euo pipefail; source scripts/lib/runner.sh; ${script}`], { cwd: root, env, timeout: 120_000 });
  return stdout;
}

export interface OwnDatabase {
  /** postgres://… of the cluster's `knucklebench` database. */
  url: string;
  /** A fast shutdown, as an operator's restart does: open connections end with 57P01. */
  stop(): Promise<void>;
  /** Starts it again (nothing when it runs). */
  start(): Promise<void>;
  /** Stops it and deletes its data. */
  remove(): Promise<void>;
}

/**
 * Points the app's modules, imported after this call, at `url` (with `extra` settings); the returned function
 * ends that pool and puts the environment back, so nothing of it outlives the test file whichever way vitest
 * reuses its workers (client.ts keeps its pool on globalThis).
 */
export function useDatabaseUrl(url: string, extra: Record<string, string> = {}): () => Promise<void> {
  const names = ["DATABASE_URL", ...Object.keys(extra)];
  const saved = Object.fromEntries(names.map((n) => [n, process.env[n]]));
  Object.assign(process.env, { DATABASE_URL: url, ...extra });
  const global = globalThis as { knucklebenchDb?: { $client?: { end(): Promise<void> } } };
  delete global.knucklebenchDb;
  return async () => {
    // A client still held by a request cut off mid-outage would keep end() waiting: give it a few seconds.
    const ended = global.knucklebenchDb?.$client?.end().catch(() => {});
    await Promise.race([ended, new Promise((r) => setTimeout(r, 5_000).unref())]);
    delete global.knucklebenchDb;
    for (const n of names) {
      if (saved[n] === undefined) delete process.env[n];
      else process.env[n] = saved[n];
    }
  };
}

/** Starts a fresh cluster NAME on PORT and applies the migrations. */
export async function startOwnDatabase(name: string, port: number): Promise<OwnDatabase> {
  const cluster = `'${name}' ${port}`;
  const url = (await bash(`kb_pg_start ${cluster} fresh >&2; echo "$DATABASE_URL"`)).trim();
  await run("npx", ["--no-install", "tsx", "scripts/migrate.ts"], { cwd: root, env: { ...process.env, DATABASE_URL: url }, timeout: 120_000 });
  return {
    url,
    stop: async () => void (await bash(`kb_pg_attach ${cluster} >&2; kb_pg_stop >&2`)),
    start: async () => void (await bash(`kb_pg_attach ${cluster} >&2; kb_pg_running || kb_pg_start ${cluster} keep >&2`)),
    remove: async () => void (await bash(`kb_pg_attach ${cluster} >&2; kb_pg_stop >&2; rm -rf "$KB_PG_DATA" "$KB_DATA/${name}.password"`)),
  };
}
