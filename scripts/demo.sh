#!/usr/bin/env bash
# `npm run demo`: the production app with the demo data on http://127.0.0.1:3000.
# Installs the dependencies if needed, starts PostgreSQL (data kept in .data/pg across runs),
# starts the local object store (files kept in .data/s3) and the local mail catcher (messages in .data/mail), migrates,
# seeds, builds, starts the design-search workers (KB_SEARCH_WORKERS, 1), serves, and prints how to sign in.
# Ctrl-C (or SIGTERM) stops the app, the workers, the mail catcher, the object store and the database.
# DATABASE_URL, when set, points the demo at that database instead.
#
# For a second demo beside the first (the interrupt test of `npm test` runs one): KB_DEMO_PORT (app,
# 3000), KB_DEMO_PG_PORT (54329), KB_DEMO_PG_NAME (the cluster's folder under .data, `pg`), and
# KB_DEMO_S3_PORT (the local object store, 54380; its files in .data/s3, or KB_DEMO_S3_NAME), and
# KB_DEMO_MAIL_PORT (the local mail catcher's SMTP port, 54430, its API on the next port; messages in
# .data/mail, or KB_DEMO_MAIL_NAME), and KB_DEMO_BUILD=reuse to serve the existing .next build instead of building. KB_S3_ENDPOINT, when set (with
# the other KB_S3_* settings), points the demo at that object store instead of the local one.
set -euo pipefail

# shellcheck source=scripts/lib/runner.sh
source "$(dirname "$0")/lib/runner.sh"

APP_PORT=${KB_DEMO_PORT:-3000}
PG_PORT=${KB_DEMO_PG_PORT:-54329}
PG_NAME=${KB_DEMO_PG_NAME:-pg}
S3_PORT=${KB_DEMO_S3_PORT:-54380}
S3_NAME=${KB_DEMO_S3_NAME:-s3}
MAIL_PORT=${KB_DEMO_MAIL_PORT:-54430}
MAIL_NAME=${KB_DEMO_MAIL_NAME:-mail}

# shellcheck disable=SC2317 # both run from traps
cleanup() {
  kb_app_stop
  kb_workers_stop
  kb_mail_stop
  kb_s3_stop
  kb_pg_stop
}
# shellcheck disable=SC2317
on_signal() {
  printf '\n'
  exit 0 # stopping on Ctrl-C is how the demo ends: not an error
}
kb_stop_on_exit cleanup on_signal

# Fail before touching anything when another program (another demo?) already serves the port.
if kb_port_busy "$APP_PORT"; then
  kb_die "port $APP_PORT on 127.0.0.1 is already in use (another demo running?)"
fi

kb_ensure_node_modules
kb_env_demo "$APP_PORT"
kb_pg_start "$PG_NAME" "$PG_PORT" keep
kb_s3_start "$S3_NAME" "$S3_PORT" keep
kb_mail_start "$MAIL_NAME" "$MAIL_PORT" $((MAIL_PORT + 1)) keep

kb_say "applying migrations"
npx --no-install tsx scripts/migrate.ts
kb_say "seeding the demo data"
# react-server: the seed imports server modules guarded by `server-only`, which throws elsewhere.
SEED_OUTPUT=$(npx --no-install tsx --conditions=react-server scripts/seed.ts) || {
  printf '%s\n' "$SEED_OUTPUT"
  kb_die "seeding failed"
}

kb_next_build_or_reuse "${KB_DEMO_BUILD:-}" || kb_die "the build failed (see above)"
kb_workers_start "${KB_SEARCH_WORKERS:-1}" search-worker
kb_app_start "$APP_PORT" || kb_die "the app did not start (see above)"

cat <<EOF

  Knucklebench is running: open http://127.0.0.1:$APP_PORT and sign in.
$(printf '%s\n' "$SEED_OUTPUT" | sed 's/^/  /')

  Press Ctrl-C to stop the app, the mail catcher, the object store and the database (the data is kept for the next run).

EOF

# Serve until the app exits or a signal arrives (the trap then stops both).
APP_EXIT=0
wait "$KB_APP_PID" || APP_EXIT=$?
kb_warn "the app exited (code $APP_EXIT)"
exit "$APP_EXIT"
