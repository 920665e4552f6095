// Design-search workers as the runners start them: separate Node processes (scripts/search-worker.ts, loaded
// by tsx) on the test database, whose output the tests read and which they may kill.
import { spawn, type ChildProcess } from "node:child_process";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("../..", import.meta.url));

export interface WorkerProcess {
  readonly proc: ChildProcess;
  readonly lines: string[];
  /** Resolves at the first output line matching `pattern`. */
  waitFor(pattern: RegExp, timeoutMs?: number): Promise<string>;
}

export function startWorker(env: Record<string, string> = {}): WorkerProcess {
  // node itself with tsx as a loader: one process, so killing it kills the worker (the tsx CLI would fork).
  const proc = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "scripts/search-worker.ts"], {
    cwd: root,
    env: { ...process.env, ...env },
    // An IPC channel: the worker stops when it closes, so an interrupted test run leaves no worker behind.
    stdio: ["ignore", "pipe", "pipe", "ipc"],
  });
  const lines: string[] = [];
  const waiters: { pattern: RegExp; resolve: (l: string) => void }[] = [];
  const onData = (chunk: Buffer) => {
    for (const line of chunk.toString().split("\n").filter(Boolean)) {
      lines.push(line);
      for (const w of [...waiters]) {
        if (w.pattern.test(line)) {
          waiters.splice(waiters.indexOf(w), 1);
          w.resolve(line);
        }
      }
    }
  };
  proc.stdout!.on("data", onData);
  proc.stderr!.on("data", onData);
  return {
    proc,
    lines,
    waitFor(pattern, timeoutMs = 30_000) {
      const seen = lines.find((l) => pattern.test(l));
      if (seen) return Promise.resolve(seen);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no line matching ${pattern} within ${timeoutMs} ms; output:\n${lines.join("\n")}`)), timeoutMs);
        waiters.push({ pattern, resolve: (l) => (clearTimeout(timer), resolve(l)) });
      });
    },
  };
}

/** Stops a worker (SIGTERM, then SIGKILL) and waits for it to be gone. */
export async function stopWorker(w: WorkerProcess, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  if (w.proc.exitCode !== null || w.proc.signalCode !== null) return;
  const exited = new Promise<void>((r) => w.proc.once("exit", () => r()));
  w.proc.kill(signal);
  const timer = setTimeout(() => w.proc.kill("SIGKILL"), 8000);
  await exited;
  clearTimeout(timer);
}
