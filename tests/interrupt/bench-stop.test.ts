// `npm run bench` stopped by Ctrl-C while its design-search benchmark runs: the benchmark, the app, the
// design-search workers, the bench mail catcher, object store and PostgreSQL end before the prompt returns. It serves the build `npm test` made (KB_BENCH_BUILD=reuse).
import { afterEach, expect, it } from "vitest";
import { endLeftovers, expectNothingLeft, MAIL_CATCHER_LINE, mailCatcherOn, OBJECT_STORE_LINE, objectStoreOn, searchWorkers, snapshotWhen, STOP_ORDER, type Started } from "./helpers/stopping";
import { openTerminal, type Terminal } from "./helpers/terminal";

let term: Terminal | undefined;
let started: Started | undefined;
let pgPort = 0;
let s3Port = 0;
let mailPort = 0;

afterEach(async () => {
  await endLeftovers(term, pgPort, started, s3Port, mailPort);
});

it("npm run bench stops its server and its database on Ctrl-C", async () => {
  term = openTerminal("exec npm run bench", { KB_BENCH_BUILD: "reuse" });
  pgPort = Number((await term.waitFor(/starting PostgreSQL on 127\.0\.0\.1:(\d+)/, 120_000))[1]);
  s3Port = Number((await term.waitFor(OBJECT_STORE_LINE, 120_000))[1]);
  mailPort = Number((await term.waitFor(MAIL_CATCHER_LINE, 120_000))[1]);
  const appPort = Number((await term.waitFor(/starting the app on http:\/\/127\.0\.0\.1:(\d+)/, 120_000))[1]);
  await term.waitFor(/design-search benchmark with 1 worker/, 120_000);
  started = await snapshotWhen(term, pgPort, (s) => searchWorkers(s.processes).length === 1);
  expect(started.processes.some((p) => p.args.includes("bench-search.ts")), "the design-search benchmark runs").toBe(true);
  expect(searchWorkers(started.processes).length, "a design-search worker runs under the terminal").toBe(1);
  expect(objectStoreOn(s3Port, started.processes).length, "the object store runs under the terminal").toBe(1);
  expect(mailCatcherOn(mailPort, started.processes).length, "the mail catcher runs under the terminal").toBe(1);

  term.interrupt();
  expect(await term.exited(90_000)).toBe(130);
  await expectNothingLeft(started, [appPort, mailPort, mailPort + 1, s3Port, pgPort]);
  expect(term.output()).toMatch(STOP_ORDER);
});
