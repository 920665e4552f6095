// A design-search worker: takes batches of a search from the pg-boss queue in DATABASE_URL's database and
// analyses them, until SIGTERM or SIGINT (the batch in hand is finished first; it is well under a second).
// The runners start these beside the app (scripts/lib/workers.sh); on another machine, run it the same way
// with the same DATABASE_URL:  npx tsx --conditions=react-server scripts/search-worker.ts
import { startSearchWorker } from "../src/server/search/search-worker";

const name = `search-worker ${process.pid}`;
const log = (line: string) => console.log(`${name}: ${line}`);
const worker = await startSearchWorker(log);
log("waiting for batches");
let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  // A batch that will not end (a database that does not answer) must not hold the process.
  setTimeout(() => process.exit(0), 5000).unref();
  void worker.stop().then(() => process.exit(0));
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
process.on("SIGHUP", stop);
// Started by a parent with an IPC channel (the integration tests): gone with that parent.
if (process.send) process.on("disconnect", stop);
