import "server-only";
import PgBoss from "pg-boss";
import { env } from "../env";

// The design search's batches on pg-boss, the job queue that lives in PostgreSQL (schema `pgboss`): the app
// sends them, and any number of worker processes (scripts/search-worker.ts), here or on other machines
// pointed at the same database, take them one at a time.

export const SEARCH_QUEUE = "design-search-batch";

/** The data of one batch's job. */
export type SearchJob = { readonly searchId: string; readonly index: number };

/**
 * How long a worker may hold a batch before pg-boss takes it back and hands it to another (a worker that
 * died mid-batch): KB_SEARCH_BATCH_TIMEOUT_SECONDS, default 30 (a batch is well under a second of work).
 */
export function batchTimeoutSeconds(): number {
  const n = Number(process.env.KB_SEARCH_BATCH_TIMEOUT_SECONDS);
  return Number.isInteger(n) && n >= 1 ? Math.min(n, 3600) : 30;
}

/** How often a worker's pg-boss looks for batches held too long (KB_SEARCH_MAINTENANCE_SECONDS, default 5). */
function maintenanceSeconds(): number {
  const n = Number(process.env.KB_SEARCH_MAINTENANCE_SECONDS);
  return Number.isInteger(n) && n >= 1 ? Math.min(n, 600) : 5;
}

const globalForBoss = globalThis as unknown as { knucklebenchBoss?: Promise<PgBoss> };

/**
 * The process's pg-boss, started once: the app only sends; a worker also supervises (takes back batches
 * held past their time). Creating the schema and the queue is idempotent, so whichever starts first makes them.
 */
export function searchBoss(role: "app" | "worker"): Promise<PgBoss> {
  globalForBoss.knucklebenchBoss ??= (async () => {
    const boss = new PgBoss({
      connectionString: env.DATABASE_URL,
      max: 3,
      supervise: role === "worker",
      schedule: false,
      maintenanceIntervalSeconds: maintenanceSeconds(),
    });
    boss.on("error", (error) => console.warn(`design search queue: ${error.message.split("\n", 1)[0]}`));
    await boss.start();
    await boss.createQueue(SEARCH_QUEUE, { name: SEARCH_QUEUE, retryLimit: 10, retryDelay: 0, expireInSeconds: batchTimeoutSeconds() });
    return boss;
  })().catch((error: unknown) => {
    globalForBoss.knucklebenchBoss = undefined; // the next call tries again (the database may be back)
    throw error;
  });
  return globalForBoss.knucklebenchBoss;
}

/** Stops this process's pg-boss (a worker on its way out). */
export async function stopSearchBoss(): Promise<void> {
  const boss = await globalForBoss.knucklebenchBoss?.catch(() => null);
  globalForBoss.knucklebenchBoss = undefined;
  await boss?.stop({ graceful: false, wait: true, close: true }).catch(() => {});
}

/** Puts batches on the queue under their own job ids: sending one whose job is already there does nothing. */
export async function sendBatches(boss: PgBoss, batches: readonly { searchId: string; index: number; jobId: string }[]): Promise<void> {
  for (const b of batches) {
    await boss.send(SEARCH_QUEUE, { searchId: b.searchId, index: b.index } satisfies SearchJob, { id: b.jobId, retryLimit: 10, retryDelay: 0, expireInSeconds: batchTimeoutSeconds() });
  }
}
