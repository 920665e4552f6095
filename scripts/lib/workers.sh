# shellcheck shell=bash
# The design-search workers (scripts/search-worker.ts): processes beside the app that take search batches
# from the pg-boss queue in DATABASE_URL's database. Source after common.sh, then:
#   kb_workers_start COUNT NAME   start COUNT workers, each in a session of its own (a Ctrl-C reaches only the
#                                 runner, which stops them in order), output to .data/NAME-N.log
#   kb_workers_stop               stop what kb_workers_start started (idempotent): SIGTERM, then SIGKILL
# KB_SEARCH_WORKERS, when set, is the count the runners pass (demo and test: 1; bench measures 1 and 2).

KB_WORKER_PIDS=()

kb_workers_start() { # COUNT NAME
  local count=$1 name=$2 i
  kb_data_dir
  kb_say "starting $count design-search worker(s) (logs: .data/$name-N.log)"
  for ((i = 1; i <= count; i++)); do
    # node with tsx as a loader (one process per worker); react-server lets it load the server modules.
    (cd "$KB_ROOT" && exec setsid node --conditions=react-server --import tsx scripts/search-worker.ts) >"$KB_DATA/$name-$i.log" 2>&1 </dev/null &
    KB_WORKER_PIDS+=("$!")
  done
}

# Marked done only once stopped: a signal that cuts a first call short leaves the exit trap's call to do it.
kb_workers_stop() {
  ((${#KB_WORKER_PIDS[@]} > 0)) || return 0
  local pid tries=0 left
  kb_say "stopping the design-search workers"
  for pid in "${KB_WORKER_PIDS[@]}"; do kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true; done
  while ((tries++ < 50)); do
    left=0
    for pid in "${KB_WORKER_PIDS[@]}"; do if kb_pid_running "$pid"; then left=1; fi; done
    ((left)) || break
    sleep 0.1
  done
  for pid in "${KB_WORKER_PIDS[@]}"; do
    kill -KILL -- "-$pid" 2>/dev/null || true
    wait "$pid" 2>/dev/null || true
  done
  KB_WORKER_PIDS=()
}
