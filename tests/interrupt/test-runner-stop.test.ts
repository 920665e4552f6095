// `npm test` stopped by Ctrl-C while its tests run (pressed again while it stops): vitest, the app, the
// design-search workers, the throwaway mail catcher, object store and PostgreSQL end before the prompt returns, and the closing line does not read as a pass.
// A short run of one file (KB_TEST_FILES), with its own cluster and report beside the run that started it.
import { rmSync } from "node:fs";
import { join } from "node:path";
import { afterAll, afterEach, expect, it } from "vitest";
import { descendants } from "./helpers/processes";
import { endLeftovers, expectNothingLeft, MAIL_CATCHER_LINE, mailCatcherOn, OBJECT_STORE_LINE, objectStoreOn, searchWorkers, snapshot, type Started } from "./helpers/stopping";
import { openTerminal, repoRoot, sleep, type Terminal } from "./helpers/terminal";

let term: Terminal | undefined;
let started: Started | undefined;
let pgPort = 0;
let s3Port = 0;
let mailPort = 0;

afterEach(async () => {
  await endLeftovers(term, pgPort, started, s3Port, mailPort);
});

afterAll(() => {
  if (started) rmSync(started.pgDataDir, { recursive: true, force: true }); // a throwaway cluster, fresh on every run
  for (const f of ["s3-test-files", "s3-test-files.keys", "s3-test-files.log", "mail-test-files", "mail-test-files.keys", "mail-test-files.log"]) rmSync(join(repoRoot, ".data", f), { recursive: true, force: true });
});

it("npm test stops its tests and its database on Ctrl-C, and reports the run as failed", async () => {
  term = openTerminal("exec npm test", { KB_TEST_FILES: "tests/api/kits-routes.test.ts" });
  pgPort = Number((await term.waitFor(/starting PostgreSQL on 127\.0\.0\.1:(\d+)/, 120_000))[1]);
  s3Port = Number((await term.waitFor(OBJECT_STORE_LINE, 120_000))[1]);
  mailPort = Number((await term.waitFor(MAIL_CATCHER_LINE, 120_000))[1]);
  await term.waitFor(/running only: /, 120_000);
  // Wait for vitest itself to run, so the Ctrl-C reaches it too, as it would a person's run.
  const deadline = Date.now() + 60_000;
  while (!descendants(term.pid).some((p) => p.args.includes("vitest"))) {
    expect(Date.now() < deadline, "vitest started").toBe(true);
    await sleep(100);
  }
  await sleep(1_000);
  started = snapshot(term, pgPort);
  expect(objectStoreOn(s3Port, started.processes).length, "the throwaway object store runs under the terminal").toBe(1);
  expect(mailCatcherOn(mailPort, started.processes).length, "the throwaway mail catcher runs under the terminal").toBe(1);
  expect(searchWorkers(started.processes).length, "a design-search worker runs under the terminal").toBeGreaterThanOrEqual(1);

  const from = term.output().length;
  term.interrupt();
  await term.waitFor(/stopping PostgreSQL/, 60_000, from);
  term.interrupt();
  expect(await term.exited(90_000)).toBe(130);
  await expectNothingLeft(started, [mailPort, mailPort + 1, s3Port, pgPort]);
  expect(term.output()).toMatch(/stopping the design-search workers[\s\S]*stopping the mail catcher[\s\S]*stopping the object store[\s\S]*stopping PostgreSQL/);
  expect(term.output()).toContain("npm test stopped early (exit code 130)");
  // The closing line CI reads (npm's spinner may follow it on the terminal).
  const closing = term.output().split(/\r?\n/).filter((line) => / passed, /.test(line)).at(-1);
  expect(closing).toMatch(/^\d+ passed, [1-9]\d* failed$/);
});
