#!/usr/bin/env bash
# npm start: from a fresh clone to a served app. Installs what is missing, starts PostgreSQL on
# loopback, migrates, builds and serves on 127.0.0.1 until interrupted.
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
exec node --no-node-snapshot --no-concurrent-recompilation dist/server/main.js
