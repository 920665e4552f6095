import "server-only";
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import { HttpError } from "../http/errors";
import { runAnalysisJob, type AnalysisJob, type AnalysisOutcome } from "./analysis-job";

// KB_ANALYSIS_WORKERS: how many worker threads solve layouts; 0 solves them on the request's own thread.
// Unset: one fewer than the cores (at least one, at most four), leaving a core for the event loop.
function poolSize(): number {
  const configured = process.env.KB_ANALYSIS_WORKERS;
  if (configured === undefined || configured === "") return Math.max(1, Math.min(4, availableParallelism() - 1));
  const n = Number(configured);
  return Number.isInteger(n) && n >= 0 ? Math.min(n, 16) : 1;
}

type Job = { id: number; resolve: (o: AnalysisOutcome) => void; reject: (e: unknown) => void };
type Slot = { worker: Worker; jobs: Map<number, Job> };

class AnalysisPool {
  private slots: Slot[] = [];
  private nextId = 1;

  constructor(private readonly size: number) {}

  private spawn(): Slot {
    const entry = new URL("./analysis-worker.ts", import.meta.url);
    // The production build bundles the worker; under vitest it is TypeScript source, which
    // KB_ANALYSIS_WORKER_TSX=1 has tsx load in the worker.
    const worker = process.env.KB_ANALYSIS_WORKER_TSX === "1"
      ? new Worker(`import("tsx/esm/api").then((tsx) => tsx.tsImport(${JSON.stringify(entry.href)}, ${JSON.stringify(entry.href)}))`, { eval: true })
      : new Worker(entry);
    const slot: Slot = { worker, jobs: new Map() };
    worker.on("message", (m: { id: number; outcome: AnalysisOutcome }) => {
      const job = slot.jobs.get(m.id);
      slot.jobs.delete(m.id);
      job?.resolve(m.outcome);
    });
    const retire = (error: unknown) => {
      // A worker that dies fails only its own jobs; the next request starts a fresh one.
      this.slots = this.slots.filter((s) => s !== slot);
      for (const job of slot.jobs.values()) job.reject(error);
      slot.jobs.clear();
    };
    worker.on("error", retire);
    worker.on("exit", (code) => retire(new Error(`analysis worker exited with code ${code}`)));
    worker.unref(); // never keeps the process alive on its own
    this.slots.push(slot);
    return slot;
  }

  run(job: AnalysisJob): Promise<AnalysisOutcome> {
    while (this.slots.length < this.size) this.spawn();
    const slot = this.slots.reduce((a, b) => (b.jobs.size < a.jobs.size ? b : a));
    const id = this.nextId++;
    return new Promise<AnalysisOutcome>((resolve, reject) => {
      slot.jobs.set(id, { id, resolve, reject });
      slot.worker.postMessage({ id, job });
    });
  }
}

const globalForPool = globalThis as unknown as { knucklebenchAnalysisPool?: AnalysisPool | null };

function pool(): AnalysisPool | null {
  if (globalForPool.knucklebenchAnalysisPool === undefined) {
    const size = poolSize();
    globalForPool.knucklebenchAnalysisPool = size > 0 ? new AnalysisPool(size) : null;
  }
  return globalForPool.knucklebenchAnalysisPool;
}

/**
 * Runs one analysis job — in a worker thread when the pool has any, so a burst of analyses does not stall
 * the event loop — and answers its JSON, or throws the job's 422 as an HttpError.
 */
export async function analysisResponse(job: AnalysisJob): Promise<Response> {
  const outcome = await runAnalysis(job);
  if (outcome.ok) return new Response(outcome.json, { headers: { "content-type": "application/json" } });
  throw new HttpError(outcome.status, outcome.code, outcome.message, outcome.fields, outcome.part ? { part: outcome.part, reason: outcome.reason } : undefined);
}

/** One job's outcome through the same workers (pages render their figures with it). */
export async function runAnalysis(job: AnalysisJob): Promise<AnalysisOutcome> {
  const workers = pool();
  return workers ? workers.run(job) : runAnalysisJob(job);
}
