// A command run as a person runs it in a terminal: `script` (util-linux, on every Debian) gives it a
// pseudo-terminal of its own, so Ctrl-C typed here goes through the terminal's line discipline and
// reaches the whole foreground process group (npm and the script under it) at once, as it does for a user.
// No native module: the pty belongs to `script`, and this side talks to it through pipes.
import { spawn, type ChildProcess } from "node:child_process";
import { fileURLToPath } from "node:url";
import { listProcesses } from "./processes";

export const repoRoot = fileURLToPath(new URL("../../..", import.meta.url));

/** What a user's shell would pass on: no test database, no app URL, no NODE_ENV=test from vitest. */
const PASSED_ON = ["PATH", "HOME", "USER", "LOGNAME", "LANG", "LC_ALL", "LC_CTYPE", "TMPDIR", "CI", "CHROMIUM_PATH"];

export interface Terminal {
  /** Everything the command printed so far (the terminal's output, with its ^C echoes). */
  readonly output: () => string;
  /** Resolves with the first match of `pattern` printed after `from` (an output offset), or rejects after `timeoutMs`. */
  waitFor(pattern: RegExp, timeoutMs: number, from?: number): Promise<RegExpMatchArray>;
  /** Types Ctrl-C. */
  interrupt(): void;
  /** Sends `signal` to the terminal's foreground process group, as `kill -TERM -PGID` would. */
  signalForeground(signal: NodeJS.Signals): void;
  /** Closes the terminal (its window closed): the session gets SIGHUP from the kernel. */
  hangUp(): void;
  /** Resolves with the command's exit code once `script` ended, or rejects after `timeoutMs`. */
  exited(timeoutMs: number): Promise<number | null>;
  /** The pid of `script` itself; what runs in the terminal is its descendants. */
  readonly pid: number;
  /** Ends whatever is left, for a failed test's cleanup (the assertions check that nothing is). */
  kill(): void;
}

export function openTerminal(command: string, env: Record<string, string>): Terminal {
  const base: Record<string, string> = {};
  for (const name of PASSED_ON) if (process.env[name] !== undefined) base[name] = process.env[name]!;
  // -q quiet, -f flush at once, -e return the command's exit code, -c the command; /dev/null: no typescript file.
  const child: ChildProcess = spawn("script", ["-qfec", command, "/dev/null"], {
    cwd: repoRoot,
    // A bare environment on purpose (no NODE_ENV, which the project types as always set).
    env: { ...base, SHELL: "/bin/sh", TERM: "xterm", ...env } as unknown as NodeJS.ProcessEnv,
    stdio: ["pipe", "pipe", "pipe"],
  });
  // A key typed after the command ended has nowhere to go: not an error of the test.
  child.stdin!.on("error", () => {});
  let text = "";
  const onData = (chunk: Buffer) => {
    text += chunk.toString("utf8");
  };
  child.stdout!.on("data", onData);
  child.stderr!.on("data", onData);
  const exit = new Promise<number | null>((resolve) => child.on("exit", (code, signal) => resolve(code ?? (signal ? -1 : null))));

  return {
    output: () => text,
    pid: child.pid!,
    async waitFor(pattern, timeoutMs, from = 0) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const match = text.slice(from).match(pattern);
        if (match) return match;
        if (child.exitCode !== null || child.signalCode !== null) throw new Error(`the command ended before printing ${pattern}:\n${tail(text)}`);
        if (Date.now() > deadline) throw new Error(`no ${pattern} within ${timeoutMs} ms:\n${tail(text)}`);
        await sleep(100);
      }
    },
    interrupt() {
      child.stdin!.write("\x03");
    },
    signalForeground(signal) {
      process.kill(-foregroundGroup(child.pid!), signal);
    },
    hangUp() {
      // `script` killed outright closes the pty's master, as a terminal window closing does: the kernel
      // hangs up the session (SIGTERM would only have `script` pass it on to the command).
      child.kill("SIGKILL");
    },
    async exited(timeoutMs) {
      let timer: NodeJS.Timeout | undefined;
      const timeout = new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error(`still running after ${timeoutMs} ms:\n${tail(text)}`)), timeoutMs);
      });
      try {
        return await Promise.race([exit, timeout]);
      } finally {
        clearTimeout(timer);
      }
    },
    kill() {
      child.kill("SIGKILL");
    },
  };
}

/** The terminal's foreground process group, as the session `script` started on it sees it. */
function foregroundGroup(scriptPid: number): number {
  const leader = listProcesses().find((p) => p.ppid === scriptPid);
  if (!leader) throw new Error("the terminal runs nothing");
  if (!(leader.tpgid > 0)) throw new Error(`no foreground process group on the terminal of ${leader.pid}`);
  return leader.tpgid;
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

const tail = (text: string) => text.split("\n").slice(-25).join("\n");
