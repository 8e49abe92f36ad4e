# shellcheck shell=bash
# Stopping and checking the processes the start script launched, by PID file only: a PID is
# trusted only when /proc/<pid>/cmdline still contains the marker we expect (so a reused PID
# of some other program is never signalled).
#   mr_pid_running PID                     → 0 while PID runs (a zombie counts as gone)
#   mr_pid_alive PIDFILE MARKER            → 0 when the recorded process is ours and running
#   mr_pid_stop PIDFILE MARKER NAME [SECS] → SIGTERM, wait for it to go (SIGKILL after SECS, 60), remove PIDFILE

mr_pid_read() {
  local file="$1" pid
  [ -f "$file" ] || return 1
  pid="$(tr -dc '0-9' <"$file")"
  [ -n "$pid" ] || return 1
  printf '%s' "$pid"
}

# True while PID runs; an exited child that is not yet reaped (a zombie) has an empty cmdline
# and counts as gone, unlike with `kill -0`.
mr_pid_running() {
  [ -r "/proc/$1/cmdline" ] && [ -n "$(tr -d '\0' <"/proc/$1/cmdline" 2>/dev/null)" ]
}

mr_pid_matches() {
  local pid="$1" marker="$2"
  [ -r "/proc/$pid/cmdline" ] || return 1
  tr '\0' ' ' <"/proc/$pid/cmdline" 2>/dev/null | grep -qF -- "$marker"
}

mr_pid_alive() {
  local pid
  pid="$(mr_pid_read "$1")" || return 1
  mr_pid_matches "$pid" "$2"
}

mr_pid_stop() {
  local file="$1" marker="$2" name="$3" limit="${4:-60}" pid i
  pid="$(mr_pid_read "$file")" || { rm -f "$file"; return 0; }
  if ! mr_pid_matches "$pid" "$marker"; then
    rm -f "$file"
    return 0
  fi
  echo "[millrace] stopping $name (pid $pid)"
  kill -TERM "$pid" 2>/dev/null || true
  # A zombie (exited, not yet reaped) has an empty cmdline, so it counts as gone.
  for ((i = 0; i < limit * 10; i++)); do
    mr_pid_matches "$pid" "$marker" || break
    sleep 0.1
  done
  if mr_pid_matches "$pid" "$marker"; then
    echo "[millrace] $name did not stop within ${limit}s; killing it"
    kill -KILL "$pid" 2>/dev/null || true
    for ((i = 0; i < 50; i++)); do
      mr_pid_matches "$pid" "$marker" || break
      sleep 0.1
    done
  fi
  wait "$pid" 2>/dev/null || true
  rm -f "$file"
}

# True when something accepts TCP connections on 127.0.0.1:PORT.
mr_port_in_use() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}
