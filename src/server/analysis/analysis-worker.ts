// Runs analyses off the main thread: validation, the engine and JSON serialisation all happen here,
// so the event loop keeps serving other requests while a layout is solved.
import { setPriority } from "node:os";
import { parentPort } from "node:worker_threads";
import { runAnalysisJob, type AnalysisJob } from "./analysis-job";

// Under load the event loop goes first: on Linux niceness is per thread, and pid 0 means this thread,
// so only this worker yields the core when both want it. Elsewhere it may apply to the whole process or
// be refused; either way analyses still run.
try {
  setPriority(0, 10);
} catch {
  // not permitted here: run at normal priority
}

parentPort?.on("message", (message: { job: AnalysisJob }) => {
  parentPort!.postMessage({ outcome: runAnalysisJob(message.job) });
});
