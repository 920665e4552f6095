// Counts every test of a run from vitest's JSON reports and prints, as the very last line, the plain
// `N passed, N failed` that CI reads. Exits 1 on any failure or when no test ran.
//
// Usage: node summarize-results.mjs [--run LABEL=REPORT.json:EXIT_CODE]... [--failure "reason"]...
//   --run      a vitest run: its JSON report and the exit code of the vitest process
//   --failure  a step that failed outside vitest (counts as one failed test)
//
// A missing or unreadable report counts as one failure; so does a test file that failed to load, and a
// vitest that exited non-zero with no failed test (an unhandled error, say).
import { readFileSync } from "node:fs";
import { relative } from "node:path";

let passed = 0;
let failed = 0;
let skipped = 0;
const problems = [];

function fail(reason) {
  failed += 1;
  problems.push(reason);
}

function countRun(label, reportPath, exitCode) {
  let report;
  try {
    report = JSON.parse(readFileSync(reportPath, "utf8"));
  } catch (error) {
    fail(`${label}: no readable results in ${reportPath} (${error.code ?? error.message})`);
    return;
  }
  let runFailures = 0;
  for (const file of report.testResults ?? []) {
    const name = relative(process.cwd(), file.name ?? "?");
    let fileFailures = 0;
    for (const test of file.assertionResults ?? []) {
      if (test.status === "passed") passed += 1;
      else if (test.status === "failed") {
        fileFailures += 1;
        fail(`${label}: ${name} > ${test.fullName ?? test.title}`);
      } else skipped += 1;
    }
    if (file.status === "failed" && fileFailures === 0) {
      fileFailures += 1;
      const reason = (file.message ?? "").split("\n")[0];
      fail(`${label}: ${name} failed to run${reason ? `: ${reason}` : ""}`);
    }
    runFailures += fileFailures;
  }
  if (exitCode !== 0 && runFailures === 0) {
    fail(`${label}: vitest exited with code ${exitCode} without a failed test (see its output above)`);
  }
}

const args = process.argv.slice(2);
for (let i = 0; i < args.length; i += 2) {
  const [flag, value] = [args[i], args[i + 1] ?? ""];
  if (flag === "--run") {
    const match = /^([^=]+)=(.+):(-?\d+)$/.exec(value);
    if (!match) throw new Error(`bad --run value: ${value}`);
    countRun(match[1], match[2], Number(match[3]));
  } else if (flag === "--failure") {
    fail(value);
  } else {
    throw new Error(`unknown argument: ${flag}`);
  }
}

if (passed + failed === 0) fail("no test ran");
if (problems.length > 0) {
  console.log("\nFailures:");
  for (const problem of problems) console.log(`  - ${problem}`);
}
if (skipped > 0) console.log(`${skipped} skipped`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
