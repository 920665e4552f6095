# shellcheck shell=bash
# A local SMTP catcher per purpose (demo, test, bench) on 127.0.0.1: every message the app sends lands there
# instead of in anyone's mailbox, and the app's mail page and the tests read it back. Source after common.sh:
#   kb_mail_start NAME SMTP_PORT API_PORT [keep|fresh]   start scripts/lib/mail-catcher-server.mjs with its
#                                        messages in .data/NAME, wait until it answers, export the KB_SMTP_*
#                                        and KB_MAIL_INBOX_* settings the app reads
#   kb_mail_stop                         stop what kb_mail_start started (idempotent)
# KB_SMTP_HOST already in the environment means "send through that server": kb_mail_start then does nothing.
#
# The SMTP user and password are generated per data folder and kept in .data/NAME.keys (0600).

KB_MAIL_PID=""

kb_mail_start() { # NAME SMTP_PORT API_PORT [keep|fresh]
  local name=$1 smtp_port=$2 api_port=$3 mode=${4:-keep}
  if [[ -n ${KB_SMTP_HOST:-} ]]; then
    kb_say "sending mail through KB_SMTP_HOST (no local mail catcher started)"
    return 0
  fi
  kb_data_dir
  local dir="$KB_DATA/$name" keys="$KB_DATA/$name.keys" log="$KB_DATA/$name.log"
  if [[ $mode == fresh ]]; then rm -rf "$dir" "$keys"; fi
  mkdir -p "$dir"
  chmod 0700 "$dir"
  if [[ ! -s $keys ]]; then
    (umask 077 && printf '%s %s\n' "kb$(kb_random_hex 6)" "$(kb_random_hex 24)" >"$keys")
  fi
  local user password
  read -r user password <"$keys"
  export KB_SMTP_USER=$user KB_SMTP_PASSWORD=$password

  if kb_port_busy "$smtp_port"; then kb_die "port $smtp_port on 127.0.0.1 is in use by another program (mail catcher SMTP)"; fi
  if kb_port_busy "$api_port"; then kb_die "port $api_port on 127.0.0.1 is in use by another program (mail catcher API)"; fi
  kb_say "starting the mail catcher: SMTP on 127.0.0.1:$smtp_port, messages in .data/$name"
  # A session of its own, like the app: a Ctrl-C reaches only the script, which then stops it in order.
  (cd "$KB_ROOT" && exec setsid node scripts/lib/mail-catcher-server.mjs "$smtp_port" "$api_port" "$dir") >"$log" 2>&1 </dev/null &
  KB_MAIL_PID=$!
  if ! node "$KB_ROOT/scripts/lib/wait-http.mjs" "http://127.0.0.1:$api_port/" 60 "$KB_MAIL_PID"; then
    tail -n 20 "$log" >&2 || true
    kb_mail_stop
    kb_die "the mail catcher did not start (log: .data/$name.log)"
  fi
  export KB_SMTP_HOST=127.0.0.1 KB_SMTP_PORT=$smtp_port KB_SMTP_SECURE=false
  export KB_MAIL_INBOX_URL="http://127.0.0.1:$api_port" KB_MAIL_INBOX_TOKEN=$password
}

# Marked done only once stopped: a signal that cuts a first call short leaves the exit trap's call to do it.
kb_mail_stop() {
  [[ -n $KB_MAIL_PID ]] || return 0
  local pid=$KB_MAIL_PID tries=0
  kb_say "stopping the mail catcher"
  kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  while kb_pid_running "$pid" && ((tries++ < 50)); do sleep 0.1; done
  kill -KILL -- "-$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  KB_MAIL_PID=""
}
