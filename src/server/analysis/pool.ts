import "server-only";
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import { HttpError } from "../http/errors";
import { runAnalysisJob, type AnalysisJob, type AnalysisOutcome } from "./analysis-job";

/**
 * How many worker threads solve layouts. KB_ANALYSIS_WORKERS wins (0 solves them on the request's own
 * thread); unset, one fewer than the cores (at least one, at most four), leaving a core to the event loop.
 */
export function analysisWorkerCount(cores: number, configured: string | undefined): number {
  if (configured === undefined || configured === "") return Math.max(1, Math.min(4, cores - 1));
  const n = Number(configured);
  return Number.isInteger(n) && n >= 0 ? Math.min(n, 16) : 1;
}

/** How many analyses may wait for a worker (KB_ANALYSIS_QUEUE, default 8); beyond that the answer is 429. */
export function analysisQueueLimit(configured: string | undefined): number {
  if (configured === undefined || configured === "") return 8;
  const n = Number(configured);
  return Number.isInteger(n) && n >= 0 ? Math.min(n, 1000) : 8;
}

type Pending = { job: AnalysisJob; resolve: (o: AnalysisOutcome) => void; reject: (e: unknown) => void };
type Slot = { worker: Worker; current: (Pending & { startedAt: number }) | null };

/** Refused because every worker is busy and the queue is full; Retry-After says when to come back. */
export class AnalysisBusyError extends HttpError {
  constructor(readonly retryAfterSeconds: number) {
    super(429, "busy", "The analysis queue is full; try again shortly.", undefined, undefined, { "retry-after": String(retryAfterSeconds) });
  }
}

class AnalysisPool {
  private slots: Slot[] = [];
  private waiting: Pending[] = [];
  // Running mean of one job's time in a worker, for Retry-After.
  private meanJobMs = 50;

  constructor(
    private readonly size: number,
    private readonly queueLimit: number,
  ) {}

  private spawn(): Slot {
    const entry = new URL("./analysis-worker.ts", import.meta.url);
    // The production build bundles the worker; under vitest it is TypeScript source, which
    // KB_ANALYSIS_WORKER_TSX=1 has tsx load in the worker.
    const worker = process.env.KB_ANALYSIS_WORKER_TSX === "1"
      ? new Worker(`import("tsx/esm/api").then((tsx) => tsx.tsImport(${JSON.stringify(entry.href)}, ${JSON.stringify(entry.href)}))`, { eval: true })
      : new Worker(entry);
    const slot: Slot = { worker, current: null };
    worker.on("message", (m: { outcome: AnalysisOutcome }) => {
      const done = slot.current;
      slot.current = null;
      if (done) {
        this.meanJobMs = 0.8 * this.meanJobMs + 0.2 * (performance.now() - done.startedAt);
        done.resolve(m.outcome);
      }
      this.dispatch();
    });
    const retire = (error: unknown) => {
      // A worker that dies fails only its own job; the next dispatch starts a fresh one.
      if (!this.slots.includes(slot)) return;
      this.slots = this.slots.filter((s) => s !== slot);
      slot.current?.reject(error);
      slot.current = null;
      this.dispatch();
    };
    worker.on("error", retire);
    worker.on("exit", (code) => retire(new Error(`analysis worker exited with code ${code}`)));
    worker.unref(); // never keeps the process alive on its own
    this.slots.push(slot);
    return slot;
  }

  /** Hands waiting jobs to idle workers, one job per worker at a time. */
  private dispatch(): void {
    while (this.waiting.length > 0) {
      while (this.slots.length < this.size) this.spawn();
      const idle = this.slots.find((s) => s.current === null);
      if (!idle) return;
      const next = this.waiting.shift()!;
      idle.current = { ...next, startedAt: performance.now() };
      idle.worker.postMessage({ job: next.job });
    }
  }

  run(job: AnalysisJob): Promise<AnalysisOutcome> {
    const busy = this.slots.filter((s) => s.current !== null).length;
    if (busy >= this.size && this.waiting.length >= this.queueLimit) {
      // Time for what is ahead to drain, rounded up to whole seconds.
      const aheadMs = ((this.waiting.length + busy) / this.size) * this.meanJobMs;
      throw new AnalysisBusyError(Math.max(1, Math.ceil(aheadMs / 1000)));
    }
    return new Promise<AnalysisOutcome>((resolve, reject) => {
      this.waiting.push({ job, resolve, reject });
      this.dispatch();
    });
  }
}

const globalForPool = globalThis as unknown as { knucklebenchAnalysisPool?: AnalysisPool | null };

function pool(): AnalysisPool | null {
  if (globalForPool.knucklebenchAnalysisPool === undefined) {
    const size = analysisWorkerCount(availableParallelism(), process.env.KB_ANALYSIS_WORKERS);
    globalForPool.knucklebenchAnalysisPool = size > 0 ? new AnalysisPool(size, analysisQueueLimit(process.env.KB_ANALYSIS_QUEUE)) : null;
  }
  return globalForPool.knucklebenchAnalysisPool;
}

/**
 * Runs one analysis job — in a worker thread when the pool has any, so a burst of analyses does not stall
 * the event loop — and answers its JSON, or throws the job's 422 (or the full queue's 429) as an HttpError.
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
