#!/usr/bin/env bash
# `npm run bench`: performance checks.
#  1. the engine benchmark (scripts/bench-engine.ts), in-process, no services;
#  2. the HTTP benchmark (scripts/bench-http.ts),
#  3. the library benchmark (scripts/bench-library.ts: a page of 50 of 5,000 kits sorted by a readout),
#     the export benchmark (scripts/bench-exports.ts: the demo kit's sheet and a 121 × 121 envelope CSV) and
#  4. the design-search benchmark (scripts/bench-search.ts: analyses per second of a search with 1 and then 2
#     worker processes, and their ratio),
#  5. the browser benchmark (scripts/bench-browser.ts: the editor drag, the kit page), all against one
#     production server on 127.0.0.1:3200 with its own throwaway database (.data/pg-bench on 54349) and
#     object store (.data/s3-bench on 54402) and mail catcher (.data/mail-bench on 54455), stopped afterwards.
set -euo pipefail

# shellcheck source=scripts/lib/runner.sh
source "$(dirname "$0")/lib/runner.sh"

# shellcheck disable=SC2317 # runs from the trap
cleanup() {
  kb_app_stop
  kb_workers_stop
  kb_mail_stop
  kb_s3_stop
  kb_pg_stop
}
kb_stop_on_exit cleanup

kb_ensure_node_modules
kb_env_common

if [[ -f scripts/bench-engine.ts ]]; then
  kb_say "engine benchmark"
  npx --no-install tsx scripts/bench-engine.ts
else
  kb_say "no scripts/bench-engine.ts yet: engine benchmark skipped"
fi

# --- HTTP, library, export and browser benchmarks ----------------------------------------------------
# All read BENCH_BASE_URL (the server below); DATABASE_URL is its own database, migrated (each
# benchmark makes the accounts and kits it needs: through the API, or for the library's 5,000 kits
# straight into that database).
APP_PORT=$(kb_free_port 3200) || kb_die "no free port for the bench app (3200-3220)"
PG_PORT=$(kb_free_port 54349) || kb_die "no free port for the bench PostgreSQL (54349-54369)"
kb_env_bench "$APP_PORT"
unset DATABASE_URL # never benchmark against the user's database
kb_pg_start pg-bench "$PG_PORT" fresh
S3_PORT=$(kb_free_port 54402) || kb_die "no free port for the bench object store (54402-54422)"
unset KB_S3_ENDPOINT # nor against the user's object store
kb_s3_start s3-bench "$S3_PORT" fresh
MAIL_PORT=$(kb_free_port 54455) || kb_die "no free port for the bench mail catcher (54455-54475)"
MAIL_API_PORT=$(kb_free_port $((MAIL_PORT + 1))) || kb_die "no free port for the bench mail catcher's API"
unset KB_SMTP_HOST
kb_mail_start mail-bench "$MAIL_PORT" "$MAIL_API_PORT" fresh
npx --no-install tsx scripts/migrate.ts
kb_next_build_or_reuse "${KB_BENCH_BUILD:-}" || kb_die "the build failed"
kb_app_start "$APP_PORT" .data/app-bench.log || kb_die "the app did not start (log: .data/app-bench.log)"
kb_workers_start 1 search-worker-bench
kb_say "design-search benchmark with 1 worker against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-search.ts 1
kb_workers_stop
kb_workers_start 2 search-worker-bench
kb_say "design-search benchmark with 2 workers against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-search.ts 2
kb_workers_stop
kb_say "HTTP benchmark against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-http.ts
kb_say "library benchmark against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-library.ts
kb_say "export benchmark against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-exports.ts
kb_say "browser benchmark against $BENCH_BASE_URL"
npx --no-install tsx scripts/bench-browser.ts
