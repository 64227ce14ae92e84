#!/usr/bin/env bash
# Development: the API with reload on 3000 and Vite on 5173 (which proxies /api).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT_DIR"
ensure_node_modules
bash scripts/db.sh start
node --import tsx server/db/migrate.ts
# People open the Vite dev server, which proxies /api and /auth to the API: sign-in callbacks,
# the same-origin check on writes and links in e-mail must all use its address.
export NODE_ENV=development PORT="${PORT:-3000}" PUBLIC_URL="${PUBLIC_URL:-http://127.0.0.1:5173}"
node --no-node-snapshot --import tsx --watch server/main.ts &
api_pid=$!
trap 'kill "$api_pid" 2>/dev/null || true' EXIT
npx vite
