# Start and stop the private services of ./tools/start and ./tools/test: MariaDB, Redis and the
# node processes (fakes, API, worker). Every start registers what it made so stop_all can undo it
# in reverse order, whatever happened in between. Sourced; needs common.sh.

LIMBUS_NODE_PIDS=()
LIMBUS_NODE_NAMES=()
LIMBUS_MARIADB_SOCKETS=()
LIMBUS_MARIADB_PIDFILES=()
LIMBUS_REDIS_PORTS=()
LIMBUS_REDIS_PIDFILES=()

_os_user() { id -un; }

# A unix socket path must fit in sun_path (108 bytes on Linux).
_check_socket_path() {
  if [ "${#1}" -gt 100 ]; then die "socket path too long for a unix socket (${#1} > 100): $1"; fi
}

_pid_alive() { [ -n "$1" ] && kill -0 "$1" 2>/dev/null; }

# _registered VALUE LIST...: whether VALUE is one of LIST.
_registered() {
  local value="$1" item
  shift
  for item in "$@"; do [ "$item" = "$value" ] && return 0; done
  return 1
}

_wait_pid_gone() {
  local pid="$1" seconds="$2" i
  for ((i = 0; i < seconds * 10; i++)); do
    _pid_alive "$pid" || return 0
    sleep 0.1
  done
  return 1
}

# mariadb_sql SOCKET SQL: runs SQL as the database root over the private socket (unix_socket
# authentication, so no root password exists anywhere).
mariadb_sql() {
  mariadb --no-defaults --socket="$1" -u "$(_os_user)" --batch --skip-column-names -e "$2"
}

# start_mariadb DIR PORT [extra mariadbd options...]: datadir DIR/mariadb, socket DIR/mariadb.sock.
start_mariadb() {
  local dir="$1" port="$2"
  shift 2
  local datadir="$dir/mariadb" socket="$dir/mariadb.sock" pidfile="$dir/mariadb.pid" logfile="$dir/mariadb.log"
  _check_socket_path "$socket"
  require_free_port "$port" mariadb
  mkdir -p "$dir"
  if [ ! -d "$datadir/mysql" ]; then
    log "mariadb: creating data directory $datadir"
    mariadb-install-db --no-defaults --user="$(_os_user)" --datadir="$datadir" \
      --auth-root-authentication-method=socket --skip-test-db >"$dir/mariadb-install.log" 2>&1 ||
      {
        tail -n 20 "$dir/mariadb-install.log" >&2
        die "mariadb-install-db failed"
      }
  fi
  "$(mariadbd_bin)" --no-defaults --user="$(_os_user)" --datadir="$datadir" --socket="$socket" \
    --pid-file="$pidfile" --port="$port" --bind-address=127.0.0.1 --skip-name-resolve \
    --log-error="$logfile" --innodb-buffer-pool-size=64M "$@" >/dev/null 2>&1 &
  local pid=$!
  # Started again after a stop (the fault test) it is still one server to stop at the end.
  if ! _registered "$socket" "${LIMBUS_MARIADB_SOCKETS[@]}"; then
    LIMBUS_MARIADB_SOCKETS+=("$socket")
    LIMBUS_MARIADB_PIDFILES+=("$pidfile")
  fi
  local i
  for ((i = 0; i < 300; i++)); do
    if mariadb-admin --no-defaults --socket="$socket" -u "$(_os_user)" ping >/dev/null 2>&1; then
      log "mariadb: ready on 127.0.0.1:$port (socket $socket)"
      return 0
    fi
    _pid_alive "$pid" || break
    sleep 0.1
  done
  tail -n 20 "$logfile" >&2 2>/dev/null || true
  die "mariadb did not become ready (log: $logfile)"
}

# mariadb_database SOCKET NAME USER PASSWORD: creates the database and a user reaching it over
# TCP from 127.0.0.1; safe to repeat, and it resets the password to the one given.
mariadb_database() {
  local socket="$1" name="$2" user="$3" password="$4"
  mariadb_sql "$socket" "
    CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER IF NOT EXISTS '$user'@'127.0.0.1' IDENTIFIED BY '$password';
    CREATE USER IF NOT EXISTS '$user'@'localhost' IDENTIFIED BY '$password';
    ALTER USER '$user'@'127.0.0.1' IDENTIFIED BY '$password';
    ALTER USER '$user'@'localhost' IDENTIFIED BY '$password';
    GRANT ALL PRIVILEGES ON \`$name\`.* TO '$user'@'127.0.0.1';
    GRANT ALL PRIVILEGES ON \`$name\`.* TO '$user'@'localhost';"
}

stop_mariadb() {
  local socket="$1" pidfile="$2" pid=''
  [ -f "$pidfile" ] && pid="$(cat "$pidfile" 2>/dev/null || true)"
  mariadb-admin --no-defaults --socket="$socket" -u "$(_os_user)" shutdown >/dev/null 2>&1 || true
  if _pid_alive "$pid" && ! _wait_pid_gone "$pid" 30; then
    log "mariadb: still running after shutdown, killing $pid"
    kill -KILL "$pid" 2>/dev/null || true
  fi
}

# start_redis DIR PORT: data in DIR/redis as an append-only file written to disk every second
# (no snapshots), so queued and running jobs outlive a restart or a crash of Redis; BullMQ must not
# lose them (docs/operations.md, "Faults"). Starting it again on the same DIR reloads that file.
start_redis() {
  local dir="$1" port="$2" pidfile="$1/redis.pid"
  require_free_port "$port" redis
  mkdir -p "$dir/redis"
  redis-server --bind 127.0.0.1 --port "$port" --save '' --appendonly yes --appendfsync everysec \
    --daemonize yes --pidfile "$pidfile" --dir "$dir/redis" --logfile "$dir/redis.log" >/dev/null ||
    die "redis-server failed to start (log: $dir/redis.log)"
  if ! _registered "$port" "${LIMBUS_REDIS_PORTS[@]}"; then
    LIMBUS_REDIS_PORTS+=("$port")
    LIMBUS_REDIS_PIDFILES+=("$pidfile")
  fi
  local i
  for ((i = 0; i < 100; i++)); do
    if [ "$(redis-cli -h 127.0.0.1 -p "$port" ping 2>/dev/null)" = PONG ]; then
      log "redis: ready on 127.0.0.1:$port"
      return 0
    fi
    sleep 0.1
  done
  die "redis did not become ready (log: $dir/redis.log)"
}

stop_redis() {
  local port="$1" pidfile="$2" pid=''
  [ -f "$pidfile" ] && pid="$(cat "$pidfile" 2>/dev/null || true)"
  redis-cli -h 127.0.0.1 -p "$port" shutdown nosave >/dev/null 2>&1 || true
  if _pid_alive "$pid" && ! _wait_pid_gone "$pid" 10; then kill -KILL "$pid" 2>/dev/null || true; fi
}

# start_node NAME LOGFILE COMMAND...: runs a node entry point in the background under
# supervise_node, its output in LOGFILE (emptied first). LIMBUS_LAST_PID is the supervisor's pid; the
# process's own is in LOGFILE's .pid beside it.
start_node() {
  local name="$1" logfile="$2"
  shift 2
  : >"$logfile"
  supervise_node "$name" "$logfile" "$@" &
  LIMBUS_LAST_PID=$!
  LIMBUS_NODE_PIDS+=("$LIMBUS_LAST_PID")
  LIMBUS_NODE_NAMES+=("$name")
}

# describe_exit STATUS: "status 1", or "status 137 (SIGKILL)" for a process a signal ended.
describe_exit() {
  if [ "$1" -gt 128 ]; then
    printf 'status %s (SIG%s)' "$1" "$(kill -l "$(($1 - 128))" 2>/dev/null || echo '?')"
  else printf 'status %s' "$1"; fi
}

# supervise_node NAME LOGFILE COMMAND...: runs COMMAND (output appended to LOGFILE, pid in LOGFILE's
# .pid) and runs it again whenever it exits, 1 s later, then 2, 4, … up to 30 s while it keeps dying,
# back to 1 s once a run has lasted a minute; each restart is logged on stderr and in LOGFILE. One
# crashed process so never takes the stack down. A process that exits before it ever printed its
# `ready …` line is not restarted: that is a set-up problem, which wait_ready then reports. SIGTERM
# stops the process (SIGKILL after 9 s) and the supervisor. Runs in the background (start_node).
supervise_node() {
  local name="$1" logfile="$2"
  shift 2
  local pidfile="${logfile%.log}.pid" child='' pause='' status started delay=1 stop=0 message
  set +e
  trap - EXIT
  trap 'stop=1; kill -TERM ${child:+"$child"} ${pause:+"$pause"} 2>/dev/null' TERM
  while :; do
    started=$SECONDS
    "$@" >>"$logfile" 2>&1 &
    child=$!
    echo "$child" >"$pidfile"
    wait "$child" 2>/dev/null
    status=$?
    if [ "$stop" -eq 1 ]; then
      _wait_pid_gone "$child" 9 || kill -KILL "$child" 2>/dev/null
      if _pid_alive "$child"; then wait "$child" 2>/dev/null; fi
      rm -f "$pidfile"
      exit 0
    fi
    child=''
    grep -qE '^ready |"msg":"ready ' "$logfile" 2>/dev/null || exit "$status"
    [ $((SECONDS - started)) -ge 60 ] && delay=1
    # A Ctrl-C reaches our process too; give the caller's TERM the moment to arrive first.
    sleep 0.5 &
    pause=$!
    wait "$pause"
    pause=''
    [ "$stop" -eq 1 ] && exit 0
    message="$name exited with $(describe_exit "$status"); restarting in $delay s"
    log "$message"
    printf '[limbus] %s\n' "$message" >>"$logfile"
    sleep "$delay" &
    pause=$!
    wait "$pause"
    pause=''
    [ "$stop" -eq 1 ] && exit 0
    delay=$((delay * 2 > 30 ? 30 : delay * 2))
  done
}

# wait_ready NAME LOGFILE PID SECONDS: waits for the contract's `ready <what> <url>` line.
wait_ready() {
  local name="$1" logfile="$2" pid="$3" seconds="$4" i
  for ((i = 0; i < seconds * 10; i++)); do
    if grep -qE '^ready |"msg":"ready ' "$logfile" 2>/dev/null; then
      log "$name: $(grep -m1 -E '^ready |"msg":"ready ' "$logfile")"
      return 0
    fi
    if ! _pid_alive "$pid"; then
      tail -n 30 "$logfile" >&2 || true
      die "$name exited before it was ready (log: $logfile)"
    fi
    sleep 0.1
  done
  tail -n 30 "$logfile" >&2 || true
  die "$name was not ready after ${seconds}s (log: $logfile)"
}

# wait_http NAME URL PID SECONDS LOGFILE: waits until URL answers at all (a degraded health
# report is still an answer; the caller decides what it needs).
wait_http() {
  local name="$1" url="$2" pid="$3" seconds="$4" logfile="$5" i
  for ((i = 0; i < seconds * 4; i++)); do
    if node -e 'fetch(process.argv[1]).then((r) => process.exit(r.status < 500 || r.status === 503 ? 0 : 1), () => process.exit(1))' "$url" 2>/dev/null; then
      log "$name: answering at $url"
      return 0
    fi
    if ! _pid_alive "$pid"; then
      tail -n 30 "$logfile" >&2 || true
      die "$name exited before it answered (log: $logfile)"
    fi
    sleep 0.25
  done
  tail -n 30 "$logfile" >&2 || true
  die "$name did not answer $url after ${seconds}s (log: $logfile)"
}

# stop_node_from INDEX: stops the node processes started at positions >= INDEX, newest first.
stop_node_from() {
  local from="$1" i pid
  for ((i = ${#LIMBUS_NODE_PIDS[@]} - 1; i >= from; i--)); do
    pid="${LIMBUS_NODE_PIDS[$i]}"
    if _pid_alive "$pid"; then
      kill -TERM "$pid" 2>/dev/null || true
      if ! _wait_pid_gone "$pid" 10; then
        log "${LIMBUS_NODE_NAMES[$i]}: no exit after SIGTERM, killing"
        kill -KILL "$pid" 2>/dev/null || true
      fi
    fi
    # Only a live one: bash (5.2) can block for good in `wait` on a child it reaped during a trap.
    if _pid_alive "$pid"; then wait "$pid" 2>/dev/null || true; fi
    unset 'LIMBUS_NODE_PIDS[i]' 'LIMBUS_NODE_NAMES[i]'
  done
  LIMBUS_NODE_PIDS=("${LIMBUS_NODE_PIDS[@]}")
  LIMBUS_NODE_NAMES=("${LIMBUS_NODE_NAMES[@]}")
}

stop_all() {
  stop_node_from 0
  local i
  for ((i = ${#LIMBUS_REDIS_PORTS[@]} - 1; i >= 0; i--)); do
    stop_redis "${LIMBUS_REDIS_PORTS[$i]}" "${LIMBUS_REDIS_PIDFILES[$i]}"
  done
  LIMBUS_REDIS_PORTS=()
  LIMBUS_REDIS_PIDFILES=()
  for ((i = ${#LIMBUS_MARIADB_SOCKETS[@]} - 1; i >= 0; i--)); do
    stop_mariadb "${LIMBUS_MARIADB_SOCKETS[$i]}" "${LIMBUS_MARIADB_PIDFILES[$i]}"
  done
  LIMBUS_MARIADB_SOCKETS=()
  LIMBUS_MARIADB_PIDFILES=()
}

# mariadb_grant_prefix SOCKET PREFIX USER: lets USER create and drop any database named
# PREFIX_<something>, for test suites that make one database per file (throwaway servers only).
mariadb_grant_prefix() {
  local socket="$1" prefix="$2" user="$3"
  mariadb_sql "$socket" "
    GRANT ALL PRIVILEGES ON \`${prefix}\\_%\`.* TO '$user'@'127.0.0.1';
    GRANT ALL PRIVILEGES ON \`${prefix}\\_%\`.* TO '$user'@'localhost';"
}
