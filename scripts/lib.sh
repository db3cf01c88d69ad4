# Shared shell functions of the start, test and bench commands. Sourced, never run on its own.
# Everything prints to stderr, prefixed, so stdout stays free for the programs it starts.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
MARIADB_PID=""
MARIADB_CNF=""

say() { printf '[clinometer] %s\n' "$*" >&2; }
die() { say "error: $*"; exit 1; }

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  local marker="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$marker" ] || [ "$ROOT/package-lock.json" -nt "$marker" ]; then
    say "installing Node dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund >&2) || die "npm ci failed"
  fi
}

# ensure_debian_package <command-to-find> <debian-package>...
ensure_debian_package() {
  local probe="$1"; shift
  if command -v "$probe" >/dev/null 2>&1 || [ -x "$probe" ]; then return 0; fi
  if [ "$(id -u)" != "0" ]; then
    die "'$probe' is missing: install Debian's package(s) $* (sudo apt-get install $*), then run again"
  fi
  say "installing Debian package(s): $* (takes a few minutes the first time)"
  if [ ! -f /var/lib/apt/.clinometer-updated ]; then
    apt-get update -qq >&2 && touch /var/lib/apt/.clinometer-updated
  fi
  # A package list from an earlier day may name files the mirror no longer has: refresh once, retry.
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >&2 \
    || { apt-get update -qq >&2 && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >&2; } \
    || die "apt-get install $* failed"
}

ensure_python_reference_libraries() {
  if ! /usr/bin/python3 -c 'import statsmodels, pandas' >/dev/null 2>&1; then
    ensure_debian_package /nonexistent/python-reference python3-statsmodels python3-pandas
  fi
}

# A TCP port that nothing listens on now (loopback).
free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}

# mariadb_start <data-folder> <port>: a private server on 127.0.0.1 with its own socket.
mariadb_start() {
  local data="$1" port="$2"
  mkdir -p "$data/run"
  MARIADB_CNF="$data/run/my.cnf"
  cat > "$MARIADB_CNF" <<CNF
[client-server]
port=$port
socket=$data/run/mariadbd.sock
[mariadbd]
user=$(id -un)
datadir=$data/mariadb
bind-address=127.0.0.1
pid-file=$data/run/mariadbd.pid
log-error=$data/run/error.log
skip-name-resolve
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
innodb_buffer_pool_size=256M
innodb_flush_log_at_trx_commit=2
max_allowed_packet=256M
CNF
  if [ ! -d "$data/mariadb/mysql" ]; then
    say "initialising a private MariaDB data folder in ${data#$ROOT/}"
    mariadb-install-db --defaults-file="$MARIADB_CNF" --skip-test-db \
      --auth-root-authentication-method=socket >"$data/run/install.log" 2>&1 \
      || die "mariadb-install-db failed: see $data/run/install.log"
  fi
  mariadbd --defaults-file="$MARIADB_CNF" >>"$data/run/error.log" 2>&1 &
  MARIADB_PID=$!
  local i
  for i in $(seq 1 100); do
    if mariadb-admin --defaults-file="$MARIADB_CNF" --user=root ping >/dev/null 2>&1; then
      say "MariaDB ready on 127.0.0.1:$port"
      return 0
    fi
    kill -0 "$MARIADB_PID" 2>/dev/null || die "mariadbd exited: see $data/run/error.log"
    sleep 0.2
  done
  die "MariaDB did not answer within 20 s: see $data/run/error.log"
}

# mariadb_prepare <database> <user> <password>: database (utf8mb4) and an application user that
# may also create and drop databases sharing the database's name as prefix (the tests use that).
mariadb_prepare() {
  local db="$1" user="$2" password="$3"
  mariadb --defaults-file="$MARIADB_CNF" --user=root <<SQL || die "could not create database $db"
CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$user'@'127.0.0.1' IDENTIFIED BY '$password';
CREATE USER IF NOT EXISTS '$user'@'localhost' IDENTIFIED BY '$password';
GRANT ALL PRIVILEGES ON \`${db//_/\\_}%\`.* TO '$user'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${db//_/\\_}%\`.* TO '$user'@'localhost';
FLUSH PRIVILEGES;
SQL
}

mariadb_stop() {
  [ -n "$MARIADB_PID" ] || return 0
  if kill -0 "$MARIADB_PID" 2>/dev/null; then
    mariadb-admin --defaults-file="$MARIADB_CNF" --user=root shutdown >/dev/null 2>&1 || kill "$MARIADB_PID" 2>/dev/null
    local i
    for i in $(seq 1 100); do kill -0 "$MARIADB_PID" 2>/dev/null || break; sleep 0.2; done
    kill -0 "$MARIADB_PID" 2>/dev/null && kill -9 "$MARIADB_PID" 2>/dev/null
    say "MariaDB stopped"
  fi
  MARIADB_PID=""
}

# Build the console when its output is missing or older than any console source or config.
ensure_console_build() {
  local out="$ROOT/dist/console/browser/index.html"
  if [ -f "$out" ] && [ -z "$(find "$ROOT/console" "$ROOT/server/src/contracts" "$ROOT/angular.json" "$ROOT/package-lock.json" -newer "$out" -type f -print -quit 2>/dev/null)" ]; then
    return 0
  fi
  say "building the console (ng build)"
  (cd "$ROOT" && NG_CLI_ANALYTICS=false npx ng build >&2) || die "console build failed"
}

# wait_for_health <url>: polls until the server answers 200 (60 s at most).
wait_for_health() {
  local i
  for i in $(seq 1 240); do
    if node -e 'fetch(process.argv[1]).then((r)=>process.exit(r.ok?0:1),()=>process.exit(1))' "$1" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  die "the server did not answer $1 within 60 s"
}
