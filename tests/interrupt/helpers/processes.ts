// The machine's processes as /proc shows them, to tell what a stopped command left running.
import { readdirSync, readFileSync } from "node:fs";

export interface Proc {
  pid: number;
  ppid: number;
  pgrp: number;
  session: number;
  /** The terminal's foreground process group (-1 without a terminal). */
  tpgid: number;
  /** Start time in clock ticks since boot: with the pid, names one process even if the pid is reused. */
  start: string;
  args: string;
}

function readProc(pid: number): Proc | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // After "pid (comm) ": state ppid pgrp session tty_nr tpgid … starttime is field 22 of the whole line.
    const f = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    if (f[0] === "Z") return undefined; // exited, only waiting to be reaped
    const args = readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").filter(Boolean).join(" ");
    return { pid, ppid: Number(f[1]), pgrp: Number(f[2]), session: Number(f[3]), tpgid: Number(f[5]), start: f[19]!, args };
  } catch {
    return undefined; // gone meanwhile
  }
}

export function listProcesses(): Proc[] {
  const procs: Proc[] = [];
  for (const name of readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    const p = readProc(Number(name));
    if (p) procs.push(p);
  }
  return procs;
}

/** Every process below `root` (not `root` itself), however deep. */
export function descendants(root: number, procs = listProcesses()): Proc[] {
  const found: Proc[] = [];
  let frontier = [root];
  while (frontier.length > 0) {
    const next = procs.filter((p) => frontier.includes(p.ppid));
    found.push(...next);
    frontier = next.map((p) => p.pid);
  }
  return found;
}

/** Those of `procs` still running (same pid and start time). */
export function stillRunning(procs: Proc[]): Proc[] {
  return procs.filter((p) => readProc(p.pid)?.start === p.start);
}

/** Processes whose command line contains any of `needles` (a cluster's port option, an app's port). */
export function matching(needles: string[], procs = listProcesses()): Proc[] {
  return procs.filter((p) => needles.some((n) => p.args.includes(n)));
}

/** The PostgreSQL postmaster listening on `port` (started with `-c port=PORT`) and its server processes. */
export function postgresOn(port: number, procs = listProcesses()): Proc[] {
  const master = procs.find((p) => /\/postgres\b/.test(p.args) && p.args.includes(` -c port=${port} `));
  return master ? [master, ...descendants(master.pid, procs)] : [];
}

/** The data folder of a postmaster (its -D argument). */
export function dataDirOf(master: Proc): string {
  const m = / -D (\S+)/.exec(master.args);
  if (!m) throw new Error(`no -D in ${master.args}`);
  return m[1]!;
}
