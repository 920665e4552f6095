// What every interrupt test checks once a command was stopped: it ended, and nothing it started is left.
import { existsSync } from "node:fs";
import { join } from "node:path";
import { expect } from "vitest";
import { listening } from "../../helpers/ports";
import { dataDirOf, descendants, listProcesses, matching, postgresOn, stillRunning, type Proc } from "./processes";
import { sleep, type Terminal } from "./terminal";

/** What a running command started: its process tree, and the PostgreSQL server on `pgPort` (which pg_ctl detached from it). */
export interface Started {
  processes: Proc[];
  pgDataDir: string;
}

/** The local object store's port, from the line the runner prints when it starts it. */
export const OBJECT_STORE_LINE = /starting the object store on 127\.0\.0\.1:(\d+)/;

/** The local object store serving `port` (scripts/lib/object-store-server.mjs), among `procs`. */
export function objectStoreOn(port: number, procs: Proc[] = listProcesses()): Proc[] {
  return matching([`object-store-server.mjs ${port} `], procs);
}

/** The local mail catcher's SMTP port, from the line the runner prints when it starts it. */
export const MAIL_CATCHER_LINE = /starting the mail catcher: SMTP on 127\.0\.0\.1:(\d+)/;

/** The local mail catcher whose SMTP side serves `port` (scripts/lib/mail-catcher-server.mjs), among `procs`. */
export function mailCatcherOn(port: number, procs: Proc[] = listProcesses()): Proc[] {
  return matching([`mail-catcher-server.mjs ${port} `], procs);
}

/** The order a runner stops what it started: the app, the design-search workers, the mail catcher, the object store, PostgreSQL. */
export const STOP_ORDER = /stopping the app[\s\S]*stopping the design-search workers[\s\S]*stopping the mail catcher[\s\S]*stopping the object store[\s\S]*stopping PostgreSQL/;

/** The design-search workers (scripts/search-worker.ts) among `procs`. */
export function searchWorkers(procs: Proc[]): Proc[] {
  return matching(["scripts/search-worker.ts"], procs);
}

export function snapshot(term: Terminal, pgPort: number): Started {
  const procs = listProcesses();
  const pg = postgresOn(pgPort, procs);
  expect(pg.length, `a PostgreSQL server on port ${pgPort}`).toBeGreaterThan(0);
  return { processes: [...descendants(term.pid, procs), ...pg], pgDataDir: dataDirOf(pg[0]!) };
}

/**
 * A snapshot once `ready` holds for it (or the last one after `ms`): a runner prints its line right after
 * forking a worker, which may not have exec'd its program yet when the line arrives.
 */
export async function snapshotWhen(term: Terminal, pgPort: number, ready: (s: Started) => boolean, ms = 10_000): Promise<Started> {
  const until = Date.now() + ms;
  let s = snapshot(term, pgPort);
  while (!ready(s) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 100));
    s = snapshot(term, pgPort);
  }
  return s;
}

const describe = (procs: Proc[]) => procs.map((p) => `${p.pid} ${p.args}`);

/**
 * Nothing of `started` runs any more, no app or PostgreSQL listens on the ports, and PostgreSQL shut down
 * cleanly (it removes postmaster.pid only then). Checked the moment the command returned, as the user's
 * prompt comes back; `settleMs` gives a command whose terminal was closed that long to finish stopping.
 */
export async function expectNothingLeft(started: Started, ports: number[], settleMs = 0): Promise<void> {
  const deadline = Date.now() + settleMs;
  while (Date.now() < deadline && stillRunning(started.processes).length > 0) await sleep(200);
  expect(describe(stillRunning(started.processes))).toEqual([]);
  for (const port of ports) expect(await listening(port), `something still listens on ${port}`).toBe(false);
  expect(existsSync(join(started.pgDataDir, "postmaster.pid")), "PostgreSQL was not shut down cleanly").toBe(false);
}

/**
 * After a failed test: ends whatever the command left (the terminal, the app, the object store on `s3Port`, the mail
 * catcher on `mailPort`, a
 * PostgreSQL server on `pgPort`, which gets a fast shutdown), so the next test and the next run start clean.
 */
export async function endLeftovers(term: Terminal | undefined, pgPort: number, started?: Started, s3Port?: number, mailPort?: number): Promise<void> {
  term?.kill();
  for (const p of stillRunning(started?.processes ?? [])) if (!p.args.includes("postgres")) tryKill(p.pid, "SIGKILL");
  // The object store runs in a session of its own: ended by its port even when no snapshot was taken.
  if (s3Port) for (const p of objectStoreOn(s3Port)) tryKill(p.pid, "SIGKILL");
  if (mailPort) for (const p of mailCatcherOn(mailPort)) tryKill(p.pid, "SIGKILL");
  const master = postgresOn(pgPort)[0];
  if (!master) return;
  tryKill(master.pid, "SIGINT");
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline && stillRunning([master]).length > 0) await sleep(200);
}

function tryKill(pid: number, signal: NodeJS.Signals): void {
  try {
    process.kill(pid, signal);
  } catch {
    // already gone
  }
}
