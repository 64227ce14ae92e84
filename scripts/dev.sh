#!/usr/bin/env bash
# Development: the API with reload on 3000 and Vite on 5173 (which proxies /api).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT_DIR"
ensure_node_modules
bash scripts/db.sh start
node --import tsx server/db/migrate.ts
export NODE_ENV=development PORT="${PORT:-3000}"
node --no-node-snapshot --import tsx --watch server/main.ts &
api_pid=$!
trap 'kill "$api_pid" 2>/dev/null || true' EXIT
npx vite
