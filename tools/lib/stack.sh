# The Limbus stack as ./tools/start and ./tools/test run it: backing services, then migrations,
# seed, worker and API. Sourced; needs common.sh, ports.sh and services.sh.

api_dist() { echo "$LIMBUS_ROOT/packages/api/dist"; }

# start_backing_services DIR DB_PORT REDIS_PORT SMTP_PORT CATCHER_HTTP_PORT S3_PORT [mariadbd options...]
# Exports the contract's connection variables except DB_NAME and REDIS_URL's database number,
# which differ between the demo, the API end-to-end run and the browser run.
start_backing_services() {
  local dir="$1" db_port="$2" redis_port="$3" smtp_port="$4" catcher_port="$5" s3_port="$6"
  shift 6
  local dist
  dist="$(api_dist)"
  [ -f "$dist/fakes/smtp-catcher.js" ] || die "missing $dist/fakes/smtp-catcher.js — did the build fail?"
  require_free_port "$smtp_port" smtp
  require_free_port "$catcher_port" mail-catcher
  require_free_port "$s3_port" s3

  start_mariadb "$dir" "$db_port" "$@"
  start_redis "$dir" "$redis_port"

  mkdir -p "$dir/logs"
  start_node smtp-catcher "$dir/logs/smtp-catcher.log" \
    env SMTP_PORT="$smtp_port" CATCHER_HTTP_PORT="$catcher_port" CATCHER_DIR="$dir/mail" \
    node "$dist/fakes/smtp-catcher.js"
  wait_ready smtp-catcher "$dir/logs/smtp-catcher.log" "$LIMBUS_LAST_PID" 20
  start_node object-store "$dir/logs/object-store.log" \
    env S3_PORT="$s3_port" S3_DIR="$dir/s3" S3_BUCKET="${S3_BUCKET:-limbus}" \
    node "$dist/fakes/object-store.js"
  wait_ready object-store "$dir/logs/object-store.log" "$LIMBUS_LAST_PID" 20

  export DB_HOST=127.0.0.1 DB_PORT="$db_port" DB_USER=limbus
  export LIMBUS_REDIS_BASE="redis://127.0.0.1:$redis_port"
  export SMTP_URL="smtp://127.0.0.1:$smtp_port" MAIL_CATCHER_URL="http://127.0.0.1:$catcher_port"
  export MAIL_FROM="${MAIL_FROM:-Limbus <no-reply@limbus.invalid>}"
  export S3_ENDPOINT="http://127.0.0.1:$s3_port" S3_BUCKET="${S3_BUCKET:-limbus}" S3_REGION=us-east-1
  export S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER S3_FORCE_PATH_STYLE=1
}

# migrate_and_seed LOGDIR: both are idempotent, so they run on every start.
migrate_and_seed() {
  local logdir="$1" dist
  dist="$(api_dist)"
  log "migrate ($DB_NAME)"
  node "$dist/cli/migrate.js" >"$logdir/migrate.log" 2>&1 || {
    tail -n 30 "$logdir/migrate.log" >&2
    die "migrations failed (log: $logdir/migrate.log)"
  }
  log "seed ($DB_NAME)"
  node "$dist/cli/seed.js" >"$logdir/seed.log" 2>&1 || {
    tail -n 30 "$logdir/seed.log" >&2
    die "seed failed (log: $logdir/seed.log)"
  }
}

# start_api_and_worker LOGDIR: needs LIMBUS_PORT and the environment above.
start_api_and_worker() {
  local logdir="$1" dist
  dist="$(api_dist)"
  require_free_port "$LIMBUS_PORT" api
  start_node worker "$logdir/worker.log" node "$dist/worker.js"
  wait_ready worker "$logdir/worker.log" "$LIMBUS_LAST_PID" 60
  start_node api "$logdir/api.log" node "$dist/main.js"
  wait_http api "http://127.0.0.1:$LIMBUS_PORT/api/health" "$LIMBUS_LAST_PID" 90 "$logdir/api.log"
}
