#!/usr/bin/env bash
# Millrace without Docker, on Debian 12 with Node.js 20.19+ (run as root, or with sudo for apt-get).
#
#   ./docker-free-start.sh          start: MariaDB, mail catcher, planner build, API on http://127.0.0.1:8080
#                                   (stays in the foreground; Ctrl-C stops everything it started, data stays)
#   ./docker-free-start.sh stop     stop a running start from another terminal
#   ./docker-free-start.sh status   show what is running
#   ./docker-free-start.sh test [vitest args...]
#                                   run every test suite against a throw-away MariaDB and mail catcher;
#                                   the last line printed is "N passed, N failed"
#
# Everything it creates lives in the git-ignored .millrace/ folder of the repo:
#   .millrace/env               the product's environment (DB password generated once, mode 600)
#   .millrace/db/{data,run}     the product's MariaDB (kept between runs)
#   .millrace/mail/             messages caught by the mail catcher (kept between runs)
#   .millrace/run/              PID files and logs of a running start
#   .millrace/test-*            throw-away state of the test command (wiped at each test run)
set -euo pipefail

MR_REPO="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd -P)"
cd "$MR_REPO"

# shellcheck source=db/apt-install.sh
source "$MR_REPO/db/apt-install.sh"
# shellcheck source=db/process-control.sh
source "$MR_REPO/db/process-control.sh"
# shellcheck source=db/mariadb.sh
source "$MR_REPO/db/mariadb.sh"

STATE="$MR_REPO/.millrace"
MIN_NODE="20.19"

log() { printf '[millrace] %s\n' "$*"; }
die() {
  printf '[millrace] error: %s\n' "$*" >&2
  exit 1
}

usage() {
  sed -n '2,10p' "$MR_REPO/docker-free-start.sh" | sed 's/^# \{0,1\}//'
}

# ---------------------------------------------------------------------------------------------
# Shared set-up steps

check_node() {
  command -v node >/dev/null 2>&1 || die "Node.js $MIN_NODE or newer is required and 'node' is not on PATH."
  local version
  version="$(node -p 'process.versions.node')"
  if ! node -e '
    const [a, b] = process.argv[1].split(".").map(Number);
    const [x, y] = process.argv[2].split(".").map(Number);
    process.exit(a > x || (a === x && b >= y) ? 0 : 1);' "$version" "$MIN_NODE"; then
    die "Node.js $MIN_NODE or newer is required; this is $version."
  fi
  command -v npm >/dev/null 2>&1 || die "npm is required and not on PATH."
}

ensure_node_modules() {
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] ||
    [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund
  fi
}

require_file() {
  [ -f "$1" ] || die "$1 is missing: $2"
}

# Values written to .millrace/env are double-quoted: readable by bash (source) and Node's --env-file.
env_line() {
  printf '%s="%s"\n' "$1" "$2"
}

env_file_value() {
  local file="$1" key="$2"
  [ -f "$file" ] || return 0
  sed -n "s/^$key=\"\{0,1\}\([^\"]*\)\"\{0,1\}\$/\1/p" "$file" | tail -n 1
}

random_secret() {
  od -An -N24 -tx1 /dev/urandom | tr -d ' \n'
}

# Waits until URL answers 200 (for the API: the database is connected), while PID is alive.
wait_for_http() {
  local url="$1" pid="$2" name="$3" seconds="$4" deadline=$((SECONDS + $4))
  while [ "$SECONDS" -lt "$deadline" ]; do
    if node -e '
      fetch(process.argv[1], { signal: AbortSignal.timeout(1000) })
        .then((r) => process.exit(r.status === 200 ? 0 : 1), () => process.exit(1));' "$url" 2>/dev/null; then
      return 0
    fi
    if ! mr_pid_running "$pid"; then
      log "$name exited while starting"
      return 1
    fi
    sleep 0.2
  done
  log "$name did not answer $url within ${seconds}s"
  return 1
}

# start_mail_catcher RUN_DIR SMTP_PORT HTTP_PORT MAIL_DIR
start_mail_catcher() {
  local run="$1" smtp="$2" http="$3" dir="$4" pid port
  for port in "$smtp" "$http"; do
    mr_port_in_use "$port" && die "port 127.0.0.1:$port (mail catcher) is already in use by another program."
  done
  MAIL_CATCHER_SMTP_PORT="$smtp" MAIL_CATCHER_HTTP_PORT="$http" MAIL_CATCHER_DIR="$dir" \
    node --import tsx "$MAIL_MARKER" </dev/null >>"$run/mail-catcher.log" 2>&1 &
  pid=$!
  echo "$pid" >"$run/mail-catcher.pid"
  if ! wait_for_http "http://127.0.0.1:$http/health" "$pid" "mail catcher" 30; then
    tail -n 20 "$run/mail-catcher.log" >&2 || true
    die "the mail catcher did not start (log: ${run#"$MR_REPO"/}/mail-catcher.log)."
  fi
  log "mail catcher: SMTP 127.0.0.1:$smtp, messages at http://127.0.0.1:$http/messages (pid $pid)"
}

# Markers that must appear in a PID's command line before we signal it.
MAIL_MARKER="$MR_REPO/apps/mail-catcher/src/main.ts"
API_MARKER="$MR_REPO/apps/api/src/server.ts"

# ---------------------------------------------------------------------------------------------
# start / stop / status

RUN="$STATE/run"
DB_BASE="$STATE/db"
DB_PIDFILE="$RUN/mariadb.pid"

stop_product() {
  mr_pid_stop "$RUN/api.pid" "$API_MARKER" "the API" 30
  mr_pid_stop "$RUN/mail-catcher.pid" "$MAIL_MARKER" "the mail catcher" 10
  mr_db_stop "$DB_BASE" "$DB_PIDFILE"
}

START_CLEANED=0
START_LAUNCHED=0
start_cleanup() {
  [ "$START_CLEANED" = 1 ] && return 0
  START_CLEANED=1
  trap - INT TERM EXIT
  stop_product
  rm -f "$RUN/start.pid"
  if [ "$START_LAUNCHED" = 1 ]; then
    log "stopped; the data stays in .millrace/ (run ./docker-free-start.sh again to continue)"
  fi
}

cmd_start() {
  mkdir -p "$RUN"
  chmod 700 "$STATE"
  if mr_pid_alive "$RUN/start.pid" "docker-free-start.sh"; then
    log "Millrace is already running (start script pid $(mr_pid_read "$RUN/start.pid")) at $(env_file_value "$STATE/env" PUBLIC_URL)"
    log "stop it with: ./docker-free-start.sh stop"
    return 0
  fi
  # Leftovers of a start that was killed without cleaning up: stop them by their PID files.
  stop_product >/dev/null
  echo "$$" >"$RUN/start.pid"
  trap 'start_cleanup; exit 0' INT TERM
  trap 'start_cleanup' EXIT

  check_node
  ensure_node_modules
  require_file apps/api/src/db/migrate.ts "the API's migration runner is not in this checkout yet."
  require_file apps/api/src/db/seed-demo.ts "the API's demo-plant loader is not in this checkout yet."
  require_file apps/api/src/server.ts "the API server is not in this checkout yet."
  mr_db_ensure_installed || die "could not install mariadb-server."
  # Chromium renders the shift-sheet PDFs; without it the app runs and "Download PDF" says so.
  if [ ! -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then
    mr_apt_install chromium || log "warning: Chromium did not install; shift-sheet PDFs are unavailable until it is."
  fi

  local port="${PORT:-8080}" db_port="${MILLRACE_DB_PORT:-3407}"
  local smtp_port="${MAIL_CATCHER_SMTP_PORT:-2525}" mail_http_port="${MAIL_CATCHER_HTTP_PORT:-2580}"
  local db_name="${MILLRACE_DB_NAME:-millrace}" db_user="${MILLRACE_DB_USER:-millrace}"
  [ "$db_port" != 3306 ] || die "MILLRACE_DB_PORT must not be 3306 (kept free for a system MariaDB/MySQL)."
  [[ "$db_name" =~ ^[A-Za-z0-9_]+$ ]] || die "MILLRACE_DB_NAME may hold only letters, digits and _ (got '$db_name')."
  [[ "$db_user" =~ ^[A-Za-z0-9_]+$ ]] || die "MILLRACE_DB_USER may hold only letters, digits and _ (got '$db_user')."
  mr_port_in_use "$port" && die "port 127.0.0.1:$port is already in use by another program; start with PORT=<free port> ./docker-free-start.sh"

  # The database password is generated once and kept in .millrace/env.
  local db_password
  db_password="$(env_file_value "$STATE/env" DB_PASSWORD)"
  [[ "$db_password" =~ ^[0-9a-f]{32,}$ ]] || db_password="$(random_secret)"

  START_LAUNCHED=1
  mr_db_init "$DB_BASE"
  mr_db_start "$DB_BASE" "$db_port" "$DB_PIDFILE"
  mr_db_sql "$DB_BASE" "
    CREATE DATABASE IF NOT EXISTS \`$db_name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER IF NOT EXISTS '$db_user'@'127.0.0.1' IDENTIFIED BY '$db_password';
    ALTER USER '$db_user'@'127.0.0.1' IDENTIFIED BY '$db_password';
    GRANT ALL PRIVILEGES ON \`$db_name\`.* TO '$db_user'@'127.0.0.1';" ||
    die "could not create the database and its user."

  local public_url="${PUBLIC_URL:-http://127.0.0.1:$port}"
  (
    umask 077
    {
      echo "# Written by docker-free-start.sh at each start; DB_PASSWORD is generated once and kept."
      env_line NODE_ENV "${NODE_ENV:-production}"
      env_line DB_HOST 127.0.0.1
      env_line DB_PORT "$db_port"
      env_line DB_NAME "$db_name"
      env_line DB_USER "$db_user"
      env_line DB_PASSWORD "$db_password"
      env_line HOST "${HOST:-127.0.0.1}"
      env_line PORT "$port"
      env_line PUBLIC_URL "$public_url"
      env_line SMTP_HOST 127.0.0.1
      env_line SMTP_PORT "$smtp_port"
      env_line SMTP_SECURE false
      env_line MAIL_FROM "${MAIL_FROM:-Millrace <no-reply@millrace.test>}"
      env_line MAIL_CATCHER_URL "http://127.0.0.1:$mail_http_port"
      env_line PLANNER_DIST "$MR_REPO/apps/planner/dist"
    } >"$STATE/env.tmp"
    mv "$STATE/env.tmp" "$STATE/env"
  )
  chmod 600 "$STATE/env"
  set -a
  # shellcheck source=/dev/null
  source "$STATE/env"
  set +a

  log "running database migrations"
  node --import tsx apps/api/src/db/migrate.ts || die "the migrations failed (see above)."
  log "loading the demo plant if the database is empty"
  node --import tsx apps/api/src/db/seed-demo.ts || die "loading the demo plant failed (see above)."

  start_mail_catcher "$RUN" "$smtp_port" "$mail_http_port" "$STATE/mail"

  log "building the planner"
  npm run build -w apps/planner -- --logLevel warn || die "the planner build failed (see above)."

  log "starting the API"
  node --import tsx "$API_MARKER" </dev/null &
  local api_pid=$!
  echo "$api_pid" >"$RUN/api.pid"
  if ! wait_for_http "http://127.0.0.1:$port/api/health" "$api_pid" "API" 60; then
    die "the API did not answer on http://127.0.0.1:$port/api/health (see its output above)."
  fi

  cat <<EOF

  Millrace is running at $public_url

  Demo sign-ins (demo plant only), password: millrace-demo
    admin@millrace.test        admin
    planner@millrace.test      planner
    supervisor@millrace.test   supervisor
    floor@millrace.test        floor lead

  Mail sent by the app:  http://127.0.0.1:$mail_http_port/messages
  Press Ctrl-C to stop (or run ./docker-free-start.sh stop); the data stays in .millrace/.

EOF
  local rc=0
  wait "$api_pid" || rc=$?
  # Only reached when the API ended by itself (a signal to this script runs the trap instead).
  log "the API exited (status $rc); stopping the rest"
  start_cleanup
  exit 1
}

cmd_stop() {
  if mr_pid_alive "$RUN/start.pid" "docker-free-start.sh"; then
    local pid i
    pid="$(mr_pid_read "$RUN/start.pid")"
    log "stopping the running start (pid $pid)"
    kill -TERM "$pid" 2>/dev/null || true
    for ((i = 0; i < 1500; i++)); do
      mr_pid_alive "$RUN/start.pid" "docker-free-start.sh" || break
      sleep 0.1
    done
  fi
  # Whatever is left (e.g. the start script was killed with -9).
  stop_product
  rm -f "$RUN/start.pid"
  log "stopped"
}

cmd_status() {
  local any=0
  mr_pid_alive "$RUN/start.pid" "docker-free-start.sh" && { log "start script: running (pid $(mr_pid_read "$RUN/start.pid"))"; any=1; }
  mr_pid_alive "$RUN/api.pid" "$API_MARKER" && { log "API: running (pid $(mr_pid_read "$RUN/api.pid")) at $(env_file_value "$STATE/env" PUBLIC_URL)"; any=1; }
  mr_pid_alive "$RUN/mail-catcher.pid" "$MAIL_MARKER" && { log "mail catcher: running (pid $(mr_pid_read "$RUN/mail-catcher.pid"))"; any=1; }
  mr_pid_alive "$DB_PIDFILE" "--datadir=$DB_BASE/data" && { log "MariaDB: running (pid $(mr_pid_read "$DB_PIDFILE")) on port $(env_file_value "$STATE/env" DB_PORT)"; any=1; }
  [ "$any" = 1 ] || log "nothing is running"
}

# ---------------------------------------------------------------------------------------------
# test

T_RUN="$STATE/test-run"
T_DB_BASE="$STATE/test-db"
T_DB_PIDFILE="$T_RUN/mariadb.pid"
T_RESULTS="$STATE/test-results.json"
T_SUMMARY_PRINTED=0

stop_test_stack() {
  mr_pid_stop "$T_RUN/mail-catcher.pid" "$MAIL_MARKER" "the test mail catcher" 10
  mr_db_stop "$T_DB_BASE" "$T_DB_PIDFILE"
}

test_exit_trap() {
  local rc=$?
  trap - EXIT INT TERM
  stop_test_stack
  rm -f "$STATE/test.pid"
  if [ "$T_SUMMARY_PRINTED" = 0 ]; then
    echo "0 passed, 1 failed"
    [ "$rc" = 0 ] && rc=1
  fi
  exit "$rc"
}

install_test_tools() {
  local -a missing=()
  mr_db_mariadbd >/dev/null && command -v mariadb-install-db >/dev/null || missing+=(mariadb-server mariadb-client)
  [ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ] || missing+=(chromium)
  command -v pdftotext >/dev/null || missing+=(poppler-utils)
  if [ "${#missing[@]}" -gt 0 ]; then
    mr_apt_install "${missing[@]}" || die "could not install ${missing[*]}."
  fi
  # LibreOffice (≈ 20 s, 90 MB) only converts XLSX in a few import tests; those skip without it.
  if ! command -v soffice >/dev/null && [ "${MILLRACE_SKIP_LIBREOFFICE:-0}" != 1 ]; then
    mr_apt_install libreoffice-calc-nogui ||
      log "warning: LibreOffice did not install; the tests that need it will be skipped."
  fi
}

cmd_test() {
  mkdir -p "$STATE"
  chmod 700 "$STATE"
  if mr_pid_alive "$STATE/test.pid" "docker-free-start.sh"; then
    echo "[millrace] error: another test run of this checkout is in progress (pid $(mr_pid_read "$STATE/test.pid")); wait for it to finish." >&2
    echo "0 passed, 1 failed"
    exit 1
  fi
  echo "$$" >"$STATE/test.pid"
  trap test_exit_trap EXIT
  trap 'exit 130' INT
  trap 'exit 143' TERM

  local db_port="${MILLRACE_TEST_DB_PORT:-3408}"
  local smtp_port="${MILLRACE_TEST_SMTP_PORT:-2526}" mail_http_port="${MILLRACE_TEST_MAIL_HTTP_PORT:-2581}"
  [ "$db_port" != 3306 ] || die "MILLRACE_TEST_DB_PORT must not be 3306."

  check_node
  install_test_tools
  ensure_node_modules

  # A previous test run that was killed may have left its processes: stop them, then wipe.
  stop_test_stack
  rm -rf "$T_RUN" "$T_DB_BASE" "$STATE/test-mail" "$T_RESULTS"
  mkdir -p "$T_RUN"

  mr_db_init "$T_DB_BASE" >/dev/null
  mr_db_start "$T_DB_BASE" "$db_port" "$T_DB_PIDFILE" \
    --innodb-flush-log-at-trx-commit=0 --sync-binlog=0 --max-connections=300
  local db_password
  db_password="$(random_secret)"
  # Suites create and drop their own databases, so the test user may create and drop any.
  mr_db_sql "$T_DB_BASE" "
    CREATE DATABASE millrace_test CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER 'millrace_test'@'127.0.0.1' IDENTIFIED BY '$db_password';
    GRANT ALL PRIVILEGES ON *.* TO 'millrace_test'@'127.0.0.1';" || die "could not create the test user."

  start_mail_catcher "$T_RUN" "$smtp_port" "$mail_http_port" "$STATE/test-mail"

  local build_failed=0
  log "building the planner"
  if ! npm run build -w apps/planner -- --logLevel warn; then
    build_failed=1
    log "the planner build FAILED; the suites still run, and the build counts as one failure"
  fi

  export NODE_ENV=test MILLRACE_TEST=1
  export DB_HOST=127.0.0.1 DB_PORT="$db_port" DB_NAME=millrace_test DB_USER=millrace_test DB_PASSWORD="$db_password"
  export HOST=127.0.0.1 PORT="${MILLRACE_TEST_PORT:-8088}"
  export PUBLIC_URL="http://127.0.0.1:$PORT"
  export SMTP_HOST=127.0.0.1 SMTP_PORT="$smtp_port" SMTP_SECURE=false MAIL_FROM="Millrace <no-reply@millrace.test>"
  export MAIL_CATCHER_URL="http://127.0.0.1:$mail_http_port"
  export PLANNER_DIST="$MR_REPO/apps/planner/dist"
  export CHROMIUM_PATH="${CHROMIUM_PATH:-/usr/bin/chromium}"
  if command -v soffice >/dev/null; then export LIBREOFFICE_PATH="$(command -v soffice)"; fi

  log "running every test suite (vitest)"
  local started=$SECONDS vitest_rc=0
  timeout --foreground --kill-after=30s "${MILLRACE_TEST_TIMEOUT:-80m}" \
    node node_modules/vitest/vitest.mjs run --reporter=default --reporter=json \
    --outputFile.json="$T_RESULTS" "$@" || vitest_rc=$?
  log "vitest finished in $((SECONDS - started)) s (exit status $vitest_rc)"

  trap - INT TERM
  stop_test_stack
  local -a extra=()
  [ "$build_failed" = 0 ] || extra+=(--extra-failure "the planner build failed")
  local rc=0
  T_SUMMARY_PRINTED=1
  # Prints the totals; its last line is "N passed, N failed". Exit 0 = all passed, 1 = failures.
  node --import tsx tests/support/print-test-summary.ts "$T_RESULTS" "$vitest_rc" "${extra[@]}" || rc=$?
  if [ "$rc" != 0 ] && [ "$rc" != 1 ]; then
    echo "0 passed, 1 failed"
    rc=1
  fi
  exit "$rc"
}

case "${1:-start}" in
  start) shift || true; cmd_start "$@" ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  test) shift; cmd_test "$@" ;;
  -h | --help | help) usage ;;
  *)
    usage >&2
    die "unknown command '$1' (use start, stop, status or test)."
    ;;
esac
