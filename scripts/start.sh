#!/usr/bin/env bash
# npm start: from a fresh clone to a served app. Installs what is missing, starts PostgreSQL on
# loopback, migrates, builds, then serves the app with a trial worker, the local fake OAuth
# provider and the local fake SMTP server, all on 127.0.0.1, until interrupted.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT_DIR"

ensure_node_modules
bash scripts/db.sh start
log "applying migrations"
node --import tsx server/db/migrate.ts
log "building the client and the server"
npm run --silent build

export NODE_ENV=production
export PORT="${PORT:-3000}"
export HOST=127.0.0.1
NODE_FLAGS=(--no-node-snapshot --no-concurrent-recompilation)

# The demo team (server/demo/): loaded only into a database without teams, in one transaction;
# its trials really run, which takes some seconds. A failed load writes nothing and the app
# starts without it. After PORT is set, so the links in its e-mails point at this server.
if [ "${DEMO_DATA:-on}" != "off" ]; then
  log "loading the demo data if the database has no teams yet"
  node "${NODE_FLAGS[@]}" --import tsx server/demo/main.ts || log "demo data not loaded; starting without it"
fi

pids=()
cleanup() {
  for pid in "${pids[@]}"; do
    pkill -TERM -P "$pid" 2>/dev/null || true
    kill "$pid" 2>/dev/null || true
  done
  wait 2>/dev/null || true
}
trap cleanup EXIT INT TERM

if [ "${FAKE_GITHUB_PORT:-3002}" != "0" ]; then
  node dist/server/fake-github.js &
  pids+=($!)
fi
if [ "${FAKE_SMTP_PORT:-2525}" != "0" ]; then
  # The fake SMTP server keeps every message; let the app's mailbox page show them.
  export MAILBOX="${MAILBOX:-on}"
  node dist/server/fake-smtp.js &
  pids+=($!)
fi
# Each trial runs in a trial process that the worker kills at TRIAL_DEADLINE_SECONDS
# (sandbox/trial-process/). As a last resort, should a trial still outlive its job, the worker
# ends itself with status 75 (server/jobs/one-trial-at-a-time.ts); start a fresh one then.
run_worker() {
  while true; do
    node "${NODE_FLAGS[@]}" dist/server/worker.js && return 0
    local status=$?
    if [ "$status" -ne 75 ]; then return "$status"; fi
    log "the worker ended itself after a stuck trial; starting a fresh one"
  done
}
run_worker &
pids+=($!)
node "${NODE_FLAGS[@]}" dist/server/main.js &
pids+=($!)
wait -n "${pids[@]}"
