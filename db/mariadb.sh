# shellcheck shell=bash
# A private MariaDB instance on loopback, run from a data directory inside the repo's git-ignored
# .millrace/ folder. Sourced by docker-free-start.sh (needs db/apt-install.sh and
# db/process-control.sh sourced first).
#
# An instance is a base directory BASE holding BASE/data (the data directory) and BASE/run
# (socket, mariadbd's own pid file, error log), plus a PID file of ours given by the caller.
#   mr_db_ensure_installed               install Debian's mariadb-server when mariadbd is missing
#   mr_db_init BASE                      create the data directory once (keeps an existing one)
#   mr_db_start BASE PORT PIDFILE [mariadbd options...]
#                                        start mariadbd on 127.0.0.1:PORT and wait until it answers
#   mr_db_secure BASE                    drop the password-less root accounts reachable over TCP
#   mr_db_sql BASE SQL                   run SQL as the instance's root (socket only, no password)
#   mr_db_stop BASE PIDFILE              SIGTERM by PID, wait until it has exited

mr_db_mariadbd() {
  if command -v mariadbd >/dev/null 2>&1; then command -v mariadbd; return; fi
  [ -x /usr/sbin/mariadbd ] && { echo /usr/sbin/mariadbd; return; }
  return 1
}

mr_db_ensure_installed() {
  mr_db_mariadbd >/dev/null && command -v mariadb-install-db >/dev/null && command -v mariadb >/dev/null && return 0
  mr_apt_install mariadb-server mariadb-client || return 1
  mr_db_mariadbd >/dev/null || { echo "[millrace] error: mariadb-server installed but mariadbd not found" >&2; return 1; }
}

# Unix socket paths are limited to 107 bytes; a deep checkout gets its socket under /tmp instead.
mr_db_socket() {
  local base="$1" sock="$1/run/mysqld.sock"
  if [ "${#sock}" -gt 100 ]; then
    sock="/tmp/millrace-db-$(printf '%s' "$base" | md5sum | cut -c1-12)/mysqld.sock"
  fi
  printf '%s' "$sock"
}

mr_db_init() {
  local base="$1" data="$1/data" out sockdir
  sockdir="$(dirname "$(mr_db_socket "$base")")"
  mkdir -p "$base/run" "$sockdir"
  chmod 700 "$base" "$base/run" "$sockdir"
  if [ -f "$data/.millrace-initialised" ]; then
    return 0
  fi
  if [ -d "$data/mysql" ]; then
    # Initialised by an older script without the marker: keep it.
    touch "$data/.millrace-initialised"
    return 0
  fi
  # No marker and no system tables: an interrupted first set-up (never held data); start over.
  rm -rf "$data"
  mkdir -p "$data"
  chmod 700 "$data"
  echo "[millrace] initialising a new MariaDB data directory in ${data#"$MR_REPO"/}"
  # A private tmpdir: two instances set up at once (product and tests) must not share /tmp's
  # temporary table names.
  mkdir -p "$(dirname "$data")/tmp"
  if ! out="$(mariadb-install-db --no-defaults --user="$(id -un)" --datadir="$data" \
    --tmpdir="$(dirname "$data")/tmp" --auth-root-authentication-method=normal --skip-test-db 2>&1)"; then
    printf '%s\n' "$out" >&2
    echo "[millrace] error: mariadb-install-db failed for $data" >&2
    return 1
  fi
  touch "$data/.millrace-initialised"
}

mr_db_start() {
  local base="$1" port="$2" pidfile="$3"
  shift 3
  local data="$base/data" run="$base/run" sock mariadbd pid i
  sock="$(mr_db_socket "$base")"
  mariadbd="$(mr_db_mariadbd)"
  if mr_pid_alive "$pidfile" "--datadir=$data"; then
    echo "[millrace] MariaDB for ${data#"$MR_REPO"/} is already running (pid $(mr_pid_read "$pidfile"))"
    return 0
  fi
  if mr_port_in_use "$port"; then
    echo "[millrace] error: port 127.0.0.1:$port is already in use by another program; choose another port for MariaDB (see MILLRACE_DB_PORT / MILLRACE_TEST_DB_PORT)." >&2
    return 1
  fi
  mkdir -p "$(dirname "$pidfile")"
  rm -f "$sock" "$run/mysqld.pid"
  mkdir -p "$base/tmp"
  # max-allowed-packet: a large plan (1000 products × 52 weeks) stores an MPS model and results of
  # several tens of MB in one row; the server's default of 16 MB refused them
  "$mariadbd" --no-defaults --user="$(id -un)" --datadir="$data" --socket="$sock" --tmpdir="$base/tmp" \
    --pid-file="$run/mysqld.pid" --log-error="$run/mysqld.err" \
    --port="$port" --bind-address=127.0.0.1 --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --max-allowed-packet=1G \
    "$@" </dev/null >>"$run/mysqld.err" 2>&1 &
  pid=$!
  echo "$pid" >"$pidfile"
  for ((i = 0; i < 600; i++)); do
    if mariadb-admin --no-defaults --socket="$sock" -uroot --connect-timeout=1 ping >/dev/null 2>&1; then
      echo "[millrace] MariaDB is up on 127.0.0.1:$port (pid $pid)"
      mr_db_secure "$base" || echo "[millrace] warning: could not drop MariaDB's password-less TCP root accounts" >&2
      return 0
    fi
    if ! mr_pid_running "$pid"; then
      wait "$pid" 2>/dev/null || true
      echo "[millrace] error: MariaDB exited while starting; the last lines of $run/mysqld.err:" >&2
      tail -n 20 "$run/mysqld.err" >&2 || true
      rm -f "$pidfile"
      return 1
    fi
    sleep 0.1
  done
  echo "[millrace] error: MariaDB did not answer within 60 s; see $run/mysqld.err" >&2
  mr_db_stop "$base" "$pidfile"
  return 1
}

# mariadb-install-db also creates root@127.0.0.1, root@::1 and root@<hostname> without a password,
# reachable over TCP by any local program. Drop them: root stays reachable only through the
# socket, which lives in a directory only our user may enter.
mr_db_secure() {
  local base="$1" host
  while IFS= read -r host; do
    [ -n "$host" ] || continue
    mr_db_sql "$base" "DROP USER IF EXISTS 'root'@'${host//\'/}';" || return 1
  done < <(mr_db_sql "$base" "SELECT host FROM mysql.user WHERE user = 'root' AND host <> 'localhost';")
  mr_db_sql "$base" "DROP USER IF EXISTS ''@'localhost';"
}

mr_db_sql() {
  mariadb --no-defaults --socket="$(mr_db_socket "$1")" -uroot --batch --skip-column-names -e "$2"
}

mr_db_stop() {
  mr_pid_stop "$2" "--datadir=$1/data" "MariaDB" 120
}
