# shellcheck shell=bash
# Build and serve the production app. Source after common.sh.
#   kb_next_build              next build; a failed build leaves .next half-written, so it is removed
#   kb_next_build_or_reuse SETTING   the same, unless SETTING is `reuse` and a build exists (serve that)
#   kb_app_start PORT [LOG]    scripts/serve.mjs (Next behind node:http) on 127.0.0.1:PORT (output to LOG, else inherited), waits until it answers
#   kb_app_stop                stops what kb_app_start started (idempotent)

KB_APP_PID=""
KB_NEXT="node_modules/next/dist/bin/next"

kb_next_build() {
  kb_say "building the app (next build)"
  if ! (cd "$KB_ROOT" && node "$KB_NEXT" build); then
    rm -rf "$KB_ROOT/.next"
    kb_warn "next build failed; removed .next so the next build starts clean"
    return 1
  fi
}

kb_next_build_or_reuse() { # SETTING
  if [[ $1 == reuse && -s $KB_ROOT/.next/BUILD_ID ]]; then
    kb_say "serving the existing build (.next)"
    return 0
  fi
  kb_next_build
}

kb_app_start() { # PORT [LOG]
  local port=$1 log=${2:-}
  if kb_port_busy "$port"; then
    kb_warn "port $port on 127.0.0.1 is in use by another program"
    return 1
  fi
  kb_say "starting the app on http://127.0.0.1:$port"
  # Node itself, not npx: npx leaves a next-server child holding the port. setsid gives the server
  # a process group of its own, so stopping it stops every worker it forked. scripts/serve.mjs rather
  # than `next start`: it records each connection's address for the auth rate limit.
  if [[ -n $log ]]; then
    (cd "$KB_ROOT" && exec setsid node scripts/serve.mjs -H 127.0.0.1 -p "$port") >"$log" 2>&1 </dev/null &
  else
    (cd "$KB_ROOT" && exec setsid node scripts/serve.mjs -H 127.0.0.1 -p "$port") </dev/null &
  fi
  KB_APP_PID=$!
  if ! node "$KB_ROOT/scripts/lib/wait-http.mjs" "http://127.0.0.1:$port/" 120 "$KB_APP_PID"; then
    [[ -z $log ]] || tail -n 30 "$log" >&2
    kb_app_stop
    return 1
  fi
}

# True while PID runs (a zombie, exited but not yet reaped, does not count).
kb_pid_running() {
  local stat
  stat=$(cat "/proc/$1/stat" 2>/dev/null) || return 1
  stat=${stat##*) } # the command name may contain spaces and parentheses
  [[ ${stat%% *} != Z ]]
}

# Marked done only once stopped: a signal that cuts a first call short leaves the exit trap's call to do it.
kb_app_stop() {
  [[ -n $KB_APP_PID ]] || return 0
  local pid=$KB_APP_PID tries=0
  kb_say "stopping the app"
  kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  while kb_pid_running "$pid" && ((tries++ < 50)); do sleep 0.2; done
  # Whatever is left of its process group (workers) must not outlive it.
  kill -KILL -- "-$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  KB_APP_PID=""
}
