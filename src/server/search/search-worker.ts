import "server-only";
import { batchToRun, failSearch, recordBatch, resumeSearches, searchIsRunning } from "./searches";
import { SEARCH_QUEUE, searchBoss, stopSearchBoss, type SearchJob } from "./search-queue";
import { REFINE_BUDGET, runRefineBatch, runSampleBatch } from "./search-space";

// One worker process's loop: take a batch from the queue, analyse its layouts, record what it found, take
// the next. Any number of these, on any machine that reaches the database, share the queue.

const IDLE_POLL_MS = 250;
/** Every so often a worker also re-queues batches of running searches that lost their job (a restart). */
const RESUME_EVERY_MS = 30_000;

export interface WorkerHandle {
  /** Finishes the batch in hand (it is short), then stops. */
  stop(): Promise<void>;
  readonly done: Promise<void>;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function startSearchWorker(log: (line: string) => void = console.log): Promise<WorkerHandle> {
  const boss = await searchBoss("worker");
  let stopping = false;
  const resumed = await resumeSearches(boss);
  if (resumed > 0) log(`resumed ${resumed} running search(es)`);
  let lastResume = Date.now();
  const done = (async () => {
    while (!stopping) {
      let jobs;
      try {
        jobs = await boss.fetch<SearchJob>(SEARCH_QUEUE, { batchSize: 1, includeMetadata: true });
      } catch (error) {
        log(`queue unavailable: ${(error as Error).message.split("\n", 1)[0]}`);
        await sleep(2000);
        continue;
      }
      const job = jobs[0];
      if (!job) {
        if (Date.now() - lastResume > RESUME_EVERY_MS) {
          lastResume = Date.now();
          await resumeSearches(boss).catch(() => 0);
        }
        await sleep(IDLE_POLL_MS);
        continue;
      }
      const { searchId, index } = job.data;
      try {
        log(`batch ${searchId}/${index} started`);
        await runBatch(searchId, index);
        await boss.complete(SEARCH_QUEUE, job.id);
        log(`batch ${searchId}/${index} done`);
      } catch (error) {
        const message = error instanceof Error ? error.message : String(error);
        log(`batch ${searchId}/${index} failed: ${message.split("\n", 1)[0]}`);
        // Retried by pg-boss; the last retry gives the search up with the reason.
        if (job.retryCount >= job.retryLimit) await failSearch(searchId, message).catch(() => {});
        await boss.fail(SEARCH_QUEUE, job.id, { message }).catch(() => {});
      }
    }
  })();

  async function runBatch(searchId: string, index: number): Promise<void> {
    const work = await batchToRun(searchId, index);
    if (!work) return; // done already, cancelled, or gone
    const { space, plan } = work;
    let lastCheck = Date.now();
    const keepGoing = async () => {
      if (Date.now() - lastCheck < 200) return true;
      lastCheck = Date.now();
      return searchIsRunning(searchId);
    };
    const result = plan.kind === "sample" ? await runSampleBatch(space, plan.from, plan.count, keepGoing) : runRefineBatch(space, plan.start, REFINE_BUDGET);
    if (!result) return; // cancelled mid-batch
    await recordBatch(boss, searchId, index, result);
  }

  return {
    done,
    async stop() {
      stopping = true;
      await done;
      await stopSearchBoss();
    },
  };
}
