#!/usr/bin/env bash
# `npm test`: every test, on a fresh machine, with nothing left running afterwards.
# Installs what is missing (Chromium, poppler-utils), starts a throwaway PostgreSQL, object store and mail catcher, migrates,
# runs vitest (unit, component, integration), builds and starts the app, runs the browser tests, stops
# everything, and ends with the line `N passed, N failed` (CI reads that line) and a non-zero exit on any failure.
#
# TEST_DATABASE_URL, when set, replaces the throwaway PostgreSQL (DATABASE_URL is ignored here on
# purpose: tests write to their database, and must not write to the one the demo or a user set up).
# TEST_S3_ENDPOINT (with the other KB_S3_* settings) likewise replaces the throwaway object store.
# KB_TEST_FILES="a.test.ts b.test.ts" runs only those vitest files, with the same setup, and stops before
# the build: a short run (the interrupt test stops one), with its own cluster and reports beside a full one.
#
# After the browser tests, the interrupt tests (tests/interrupt/) start `npm run demo`, `npm test` (with
# KB_TEST_FILES) and `npm run bench` in a pseudo-terminal, stop each by a signal, and check that nothing is
# left running; they serve the build made here.
set -euo pipefail

# shellcheck source=scripts/lib/runner.sh
source "$(dirname "$0")/lib/runner.sh"

CHROMIUM=${CHROMIUM_PATH:-/usr/bin/chromium}
ONLY_FILES=${KB_TEST_FILES:-}
RUN_NAME=test
if [[ -n $ONLY_FILES ]]; then RUN_NAME=test-files; fi
UNIT_REPORT=.data/vitest-$RUN_NAME.json
E2E_REPORT=.data/vitest-e2e.json
STOP_REPORT=.data/vitest-interrupt.json
UNIT_EXIT=""
E2E_EXIT=""
STOP_EXIT=""
FAILURES=()
SUMMARIZED=0
STARTED=$SECONDS

cleanup() {
  kb_app_stop
  kb_workers_stop
  kb_mail_stop
  kb_s3_stop
  kb_pg_stop
}
summarize() { # extra summarizer arguments
  local runs=()
  if [[ -n $UNIT_EXIT ]]; then runs+=(--run "vitest=$UNIT_REPORT:$UNIT_EXIT"); fi
  if [[ -n $E2E_EXIT ]]; then runs+=(--run "browser=$E2E_REPORT:$E2E_EXIT"); fi
  if [[ -n $STOP_EXIT ]]; then runs+=(--run "interrupt=$STOP_REPORT:$STOP_EXIT"); fi
  SUMMARIZED=1
  node scripts/lib/summarize-results.mjs "${runs[@]}" "${FAILURES[@]}" "$@"
}
# shellcheck disable=SC2317 # both run from traps
on_exit() { # EXIT_CODE
  cleanup
  # Stopped early (a setup step failed, or a signal): CI still gets its closing line.
  if ((!SUMMARIZED)); then summarize --failure "npm test stopped early (exit code $1)" || true; fi
}
# shellcheck disable=SC2317
on_signal() {
  kb_warn "interrupted: stopping what the tests started"
}
kb_stop_on_exit on_exit on_signal

# --- what must be installed -------------------------------------------------------------------
kb_data_dir
kb_ensure_node_modules
if [[ ! -x $CHROMIUM ]]; then
  if kb_is_root; then
    kb_apt_install chromium fonts-liberation
  else
    kb_die "the browser tests need Chromium at $CHROMIUM, and it is missing.
    Install it (Debian: sudo apt-get install chromium), run npm test as root to have it done,
    or set CHROMIUM_PATH to a Chromium or Chrome binary."
  fi
fi
export CHROMIUM_PATH=$CHROMIUM
# The export tests read the dimension sheet back with poppler's pdftotext and render it with pdftoppm.
if ! command -v pdftotext >/dev/null || ! command -v pdftoppm >/dev/null; then
  if kb_is_root; then
    kb_apt_install poppler-utils
  else
    kb_die "the export tests need poppler's pdftotext and pdftoppm, and they are missing.
    Install them (Debian: sudo apt-get install poppler-utils) or run npm test as root to have it done."
  fi
fi

# --- throwaway database and the test environment ----------------------------------------------
PG_PORT=$(kb_free_port 54339) || kb_die "no free port for the test PostgreSQL (54339-54359)"
APP_PORT=$(kb_free_port 3100) || kb_die "no free port for the test app (3100-3120)"
S3_PORT=$(kb_free_port 54381) || kb_die "no free port for the test object store (54381-54401)"
MAIL_PORT=$(kb_free_port 54432) || kb_die "no free port for the test mail catcher (54432-54452)"
MAIL_API_PORT=$(kb_free_port $((MAIL_PORT + 1))) || kb_die "no free port for the test mail catcher's API"
kb_env_test "$APP_PORT"
if [[ -n ${TEST_DATABASE_URL:-} ]]; then
  export DATABASE_URL=$TEST_DATABASE_URL
  kb_say "using the database at TEST_DATABASE_URL"
else
  unset DATABASE_URL
  kb_pg_start "pg-$RUN_NAME" "$PG_PORT" fresh
fi
# The tests write files too: a throwaway object store beside the database (TEST_S3_ENDPOINT names another).
if [[ -n ${TEST_S3_ENDPOINT:-} ]]; then
  export KB_S3_ENDPOINT=$TEST_S3_ENDPOINT
  kb_say "using the object store at TEST_S3_ENDPOINT"
else
  unset KB_S3_ENDPOINT
  kb_s3_start "s3-$RUN_NAME" "$S3_PORT" fresh
fi
# The tests read what the app sends: always a throwaway mail catcher, never a real SMTP server.
unset KB_SMTP_HOST
kb_mail_start "mail-$RUN_NAME" "$MAIL_PORT" "$MAIL_API_PORT" fresh

MIGRATED=1
kb_say "applying migrations"
if ! npx --no-install tsx scripts/migrate.ts; then
  MIGRATED=0
  FAILURES+=(--failure "migrations did not apply (scripts/migrate.ts)")
fi
# Design-search workers on the test database, as the demo runs them: the browser tests' searches need them
# (the integration tests start and kill workers of their own beside these).
if ((MIGRATED)); then kb_workers_start "${KB_SEARCH_WORKERS:-1}" search-worker-$RUN_NAME; fi

# --- unit, component and integration tests ----------------------------------------------------
rm -f "$UNIT_REPORT"
if [[ -n $ONLY_FILES ]]; then
  kb_say "running only: $ONLY_FILES (KB_TEST_FILES)"
  UNIT_EXIT=0
  # shellcheck disable=SC2086 # a list of files, split on spaces
  npx --no-install vitest run --config tests/vitest.config.ts --reporter=default --reporter=json \
    --outputFile="$UNIT_REPORT" $ONLY_FILES || UNIT_EXIT=$?
  cleanup
  summarize
  exit
fi
rm -f "$E2E_REPORT" "$STOP_REPORT"
kb_say "running unit, component and integration tests"
UNIT_EXIT=0
npx --no-install vitest run --config tests/vitest.config.ts --reporter=default --reporter=json \
  --outputFile="$UNIT_REPORT" || UNIT_EXIT=$?

# --- browser tests against the production build -----------------------------------------------
if ((MIGRATED == 0)); then
  FAILURES+=(--failure "browser tests not run: no migrated database")
elif ! kb_next_build; then
  FAILURES+=(--failure "browser tests not run: next build failed")
# The app trusts one proxy hop here: the browser tests give each page and each person of theirs a client
# address of its own in X-Forwarded-For, so the auth rate limits (on, as in production) never pool them;
# the rate-limit tests themselves send from one address.
elif ! KB_TRUST_PROXY_HOPS=1 kb_app_start "$APP_PORT" .data/app-test.log; then
  FAILURES+=(--failure "browser tests not run: the app did not start (log: .data/app-test.log)")
else
  kb_say "running browser tests against $E2E_BASE_URL (app log: .data/app-test.log)"
  E2E_EXIT=0
  npx --no-install vitest run --config tests/e2e/vitest.e2e.config.ts --reporter=default \
    --reporter=json --outputFile="$E2E_REPORT" || E2E_EXIT=$?
fi

kb_app_stop

# --- interrupt tests: the runners stopped by signals, against the build above -----------------------
if [[ ! -s .next/BUILD_ID ]]; then
  FAILURES+=(--failure "interrupt tests not run: no build to serve")
else
  kb_say "running interrupt tests (npm run demo, npm test, npm run bench stopped by signals)"
  STOP_EXIT=0
  npx --no-install vitest run --config tests/interrupt/vitest.interrupt.config.ts --reporter=default \
    --reporter=json --outputFile="$STOP_REPORT" || STOP_EXIT=$?
fi

# --- stop everything, then the closing line ---------------------------------------------------
cleanup
kb_say "tests took $((SECONDS - STARTED)) s"
summarize
