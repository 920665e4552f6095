// Runs analyses off the main thread: validation, the engine and JSON serialisation all happen here,
// so the event loop keeps serving other requests while a layout is solved.
import { parentPort } from "node:worker_threads";
import { runAnalysisJob, type AnalysisJob } from "./analysis-job";

parentPort?.on("message", (message: { id: number; job: AnalysisJob }) => {
  parentPort!.postMessage({ id: message.id, outcome: runAnalysisJob(message.job) });
});
