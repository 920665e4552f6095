# shellcheck shell=bash
# The app's environment for each way the scripts run it: the one place to add a variable.
# Source after common.sh. README's configuration table lists what the app itself reads.

kb_env_common() {
  export NEXT_TELEMETRY_DISABLED=1
  # The pinned AWS SDK runs on Node 20; its notice that later releases will need Node 22 is for whoever
  # upgrades it (DEVELOPERS.md says so), not a line for every process that loads it.
  export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED=true
}

# Demo: the user's own values win; the auth secret is generated once and kept in .data.
kb_env_demo() { # APP_PORT
  kb_env_common
  export BETTER_AUTH_URL="${BETTER_AUTH_URL:-http://127.0.0.1:$1}"
  if [[ -z ${BETTER_AUTH_SECRET:-} ]]; then
    local file="$KB_DATA/auth-secret"
    kb_data_dir
    if [[ ! -s $file ]]; then
      (umask 077 && kb_random_hex 32 >"$file")
    fi
    BETTER_AUTH_SECRET=$(<"$file")
    export BETTER_AUTH_SECRET
  fi
  # --- demo-only app variables go here ---
}

# Tests: fixed throwaway values, whatever the caller's shell holds.
kb_env_test() { # APP_PORT
  kb_env_common
  export BETTER_AUTH_URL="http://127.0.0.1:$1"
  export BETTER_AUTH_SECRET="knucklebench-test-secret-0000000000000000000000000000000000000000"
  export E2E_BASE_URL="http://127.0.0.1:$1"
  # --- test-only app variables (test mode, relaxed rate limits, ...) go here ---
}

# Benchmarks: like tests, against their own server and database.
kb_env_bench() { # APP_PORT
  kb_env_test "$1"
  export BENCH_BASE_URL="http://127.0.0.1:$1"
  # --- bench-only app variables go here ---
}
