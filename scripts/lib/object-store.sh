# shellcheck shell=bash
# A local S3-compatible object store per purpose (demo, test, bench) on 127.0.0.1, for the files the app keeps
# (test-run photos, reference underlays). Source after common.sh, then:
#   kb_s3_start NAME PORT [keep|fresh]   start scripts/lib/object-store-server.mjs with its data in .data/NAME,
#                                        wait until it answers, export the KB_S3_* settings the app reads
#   kb_s3_stop                           stop what kb_s3_start started (idempotent)
# KB_S3_ENDPOINT already in the environment means "use that object store": kb_s3_start then does nothing.
#
# The key pair is generated per data folder and kept in .data/NAME.keys (0600); the server checks every
# request's signature against it, as a real provider does.

KB_S3_PID=""

kb_s3_start() { # NAME PORT [keep|fresh]
  local name=$1 port=$2 mode=${3:-keep}
  if [[ -n ${KB_S3_ENDPOINT:-} ]]; then
    kb_say "using the object store at KB_S3_ENDPOINT (no local object store started)"
    return 0
  fi
  kb_data_dir
  local dir="$KB_DATA/$name" keys="$KB_DATA/$name.keys" log="$KB_DATA/$name.log"
  if [[ $mode == fresh ]]; then rm -rf "$dir" "$keys"; fi
  mkdir -p "$dir"
  chmod 0700 "$dir"
  if [[ ! -s $keys ]]; then
    (umask 077 && printf '%s %s\n' "kb$(kb_random_hex 8)" "$(kb_random_hex 24)" >"$keys")
  fi
  local id secret
  read -r id secret <"$keys"
  export KB_S3_ACCESS_KEY_ID=$id KB_S3_SECRET_ACCESS_KEY=$secret
  export KB_S3_BUCKET=${KB_S3_BUCKET:-knucklebench} KB_S3_REGION=${KB_S3_REGION:-us-east-1} KB_S3_FORCE_PATH_STYLE=true

  if kb_port_busy "$port"; then kb_die "port $port on 127.0.0.1 is in use by another program (object store)"; fi
  kb_say "starting the object store on 127.0.0.1:$port (data in .data/$name)"
  # A session of its own, like the app: a Ctrl-C reaches only the script, which then stops it in order.
  (cd "$KB_ROOT" && exec setsid node scripts/lib/object-store-server.mjs "$port" "$dir" "$KB_S3_BUCKET") >"$log" 2>&1 </dev/null &
  KB_S3_PID=$!
  if ! node "$KB_ROOT/scripts/lib/wait-http.mjs" "http://127.0.0.1:$port/" 60 "$KB_S3_PID"; then
    tail -n 20 "$log" >&2 || true
    kb_s3_stop
    kb_die "the object store did not start (log: .data/$name.log)"
  fi
  export KB_S3_ENDPOINT="http://127.0.0.1:$port"
}

# Marked done only once stopped: a signal that cuts a first call short leaves the exit trap's call to do it.
kb_s3_stop() {
  [[ -n $KB_S3_PID ]] || return 0
  local pid=$KB_S3_PID tries=0
  kb_say "stopping the object store"
  kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  while kb_pid_running "$pid" && ((tries++ < 50)); do sleep 0.1; done
  kill -KILL -- "-$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  KB_S3_PID=""
}
