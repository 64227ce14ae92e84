#!/usr/bin/env bash
# npm test: the same set-up as npm start, then every check and every test. Prints one closing
# line "N passed, N failed" and stops every server it started, pass or fail.
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT_DIR"

OUT_DIR="$ROOT_DIR/.test-output"
rm -rf "$OUT_DIR" && mkdir -p "$OUT_DIR"
checks_passed=0
checks_failed=0
started_db=0

cleanup() {
  if [ "$started_db" -eq 1 ]; then bash scripts/db.sh stop || true; fi
}
trap cleanup EXIT

fail_setup() {
  log "set-up failed: $*"
  echo "0 passed, 1 failed"
  exit 1
}

ensure_node_modules || fail_setup "npm ci"
ensure_chromium || fail_setup "installing chromium"
if ! bash scripts/db.sh status >/dev/null 2>&1; then started_db=1; fi
bash scripts/db.sh start || fail_setup "starting PostgreSQL"

# A named check: counted in the closing line like a test.
run_check() {
  local name="$1"
  shift
  log "check: $name"
  if "$@" >"$OUT_DIR/$name.log" 2>&1; then
    checks_passed=$((checks_passed + 1))
    log "check: $name passed"
  else
    checks_failed=$((checks_failed + 1))
    log "check: $name FAILED; its output:"
    cat "$OUT_DIR/$name.log" >&2
  fi
}

run_check typecheck npm run --silent typecheck
run_check lint npm run --silent lint
run_check build npm run --silent build

log "running vitest (unit, integration, end-to-end)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$OUT_DIR/vitest.json"
vitest_status=$?

read -r tests_passed tests_failed < <(node -e "
  try {
    const r = require(process.argv[1]);
    const failed = r.numFailedTests + (r.numFailedTestSuites > 0 && r.numFailedTests === 0 ? r.numFailedTestSuites : 0);
    console.log(r.numPassedTests + ' ' + failed);
  } catch { console.log('0 1'); }
" "$OUT_DIR/vitest.json")
if [ "$vitest_status" -ne 0 ] && [ "$tests_failed" -eq 0 ]; then tests_failed=1; fi

log "checks: $checks_passed passed, $checks_failed failed; tests: $tests_passed passed, $tests_failed failed"
passed=$((checks_passed + tests_passed))
failed=$((checks_failed + tests_failed))
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
