# shellcheck shell=bash
# Stopping on Ctrl-C, SIGTERM or a closed terminal. Source after common.sh, then:
#   kb_stop_on_exit STOP_FN [SIGNAL_FN]
# STOP_FN runs once whenever the script ends (done, failed, or signalled) and gets the exit code.
# SIGNAL_FN, when given, runs first on a signal with the exit code the script will end with
# (130 INT, 143 TERM, 129 HUP); it may `exit` with another code.
#
# Why it is more than `trap cleanup EXIT`: `npm run X` puts npm and this script in the terminal's process
# group, so one Ctrl-C reaches the script twice — once from the terminal, once when npm forwards it — and
# a user may press it again while PostgreSQL is stopping. Any signal that arrives once stopping has
# begun is ignored (and SIGPIPE: a `| tee` the Ctrl-C ended) by this shell and by what it starts (ignored signals stay ignored across exec), so
# the app and then the database are always stopped.

KB_STOP_FN=""
KB_SIGNAL_FN=""
KB_STOPPING=0

kb_stop_on_exit() { # STOP_FN [SIGNAL_FN]
  KB_STOP_FN=$1
  KB_SIGNAL_FN=${2:-}
  trap _kb_on_exit EXIT
  trap '_kb_on_signal 130' INT
  trap '_kb_on_signal 143' TERM
  trap '_kb_on_signal 129' HUP
}

# shellcheck disable=SC2317 # runs from a trap
_kb_on_signal() { # EXIT_CODE
  trap '' INT TERM HUP PIPE
  KB_STOPPING=1
  if [[ -n $KB_SIGNAL_FN ]]; then "$KB_SIGNAL_FN" "$1"; fi
  exit "$1"
}

# shellcheck disable=SC2317 # runs from a trap
_kb_on_exit() {
  local code=$?
  trap '' INT TERM HUP PIPE
  KB_STOPPING=1
  # Stopping must go to the end: no `set -e` abort on a failed message (a closed terminal) or step.
  set +e
  "$KB_STOP_FN" "$code"
}
