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
# Files named *.quiet.test.ts check timing verdicts on real kernels: they run afterwards, on their
# own, so the rest of the suite (browsers, load and hostile-kernel tests) does not crowd the cores.
npx vitest run --exclude '**/*.quiet.test.ts' \
  --reporter=default --reporter=json --outputFile.json="$OUT_DIR/vitest.json"
vitest_status=$?
log "running the timing tests on a quiet machine"
npx vitest run .quiet.test.ts \
  --reporter=default --reporter=json --outputFile.json="$OUT_DIR/vitest-quiet.json"
quiet_status=$?

# Passed and failed tests of one JSON report; a report that is missing counts as one failure.
count_tests() {
  node -e "
    try {
      const r = require(process.argv[1]);
      const failed = r.numFailedTests + (r.numFailedTestSuites > 0 && r.numFailedTests === 0 ? r.numFailedTestSuites : 0);
      console.log(r.numPassedTests + ' ' + failed);
    } catch { console.log('0 1'); }
  " "$1"
}
read -r main_passed main_failed < <(count_tests "$OUT_DIR/vitest.json")
read -r quiet_passed quiet_failed < <(count_tests "$OUT_DIR/vitest-quiet.json")
if [ "$vitest_status" -ne 0 ] && [ "$main_failed" -eq 0 ]; then main_failed=1; fi
if [ "$quiet_status" -ne 0 ] && [ "$quiet_failed" -eq 0 ]; then quiet_failed=1; fi
tests_passed=$((main_passed + quiet_passed))
tests_failed=$((main_failed + quiet_failed))

log "checks: $checks_passed passed, $checks_failed failed; tests: $tests_passed passed, $tests_failed failed"
passed=$((checks_passed + tests_passed))
failed=$((checks_failed + tests_failed))
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
