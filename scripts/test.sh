#!/usr/bin/env bash
# `npm test`: the same set-up as npm start, with a separate database `sheetsmith_test` dropped and recreated
# on each run, then every test (or the ones named: npm test -- tests/server). Ends with a plain line
# "N passed, N failed" and a non-zero exit status when anything failed.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/setup.sh
source scripts/postgres.sh

# Two runs at once would drop each other's database.
mkdir -p .cache
exec 8>"/var/tmp/sheetsmith-test-run.lock"
if ! flock -n 8; then
  echo "test: another test run holds the test database; waiting for it to finish" >&2
  flock 8
fi

ensure_node_deps
# The tests start their own mail catcher, payment fake and s3rver in-process on random loopback ports; these
# are the packages they need (a partial install would otherwise show up as many confusing failures).
node -e "
  const need = ['smtp-server', 'mailparser', 'nodemailer', 'stripe', 's3rver', '@aws-sdk/client-s3', 'pg-boss', 'supertest'];
  const missing = need.filter((m) => { try { require.resolve(m); return false; } catch { return true; } });
  if (missing.length) { console.error('test: missing npm packages ' + missing.join(', ') + '; run npm ci'); process.exit(1); }
"
# The cluster outlives this run: it must not inherit the run lock (fd 8), or the next run waits forever.
bash scripts/postgres.sh 8>&-
PG_BIN=$(pg_find_bin)
TEST_DB=sheetsmith_test
pg_recreate_database "$TEST_DB"
export DATABASE_URL
DATABASE_URL=$(pg_url "$TEST_DB")
node --import tsx db/migrate.ts
web_build_ok=1
ensure_web_build || web_build_ok=0
if [ "$web_build_ok" -eq 0 ]; then
  # Keep testing the rest, but a broken web build is a failed run: the browser tests would skip on no dist/.
  echo "test: the web build failed; the run will be marked failed (see .data/logs/web-build.log)" >&2
fi

if [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" -eq 0 ]; then
    echo "test: installing Chromium from Debian's packages for the browser tests" >&2
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "test: /usr/bin/chromium is missing and this is not root; the browser tests will fail (sudo apt-get install chromium)" >&2
  fi
fi

export NODE_ENV=test NO_COLOR=1
report=.cache/vitest-report.json
rm -f "$report"
set +e
npx vitest run --reporter=default --reporter=json --outputFile="$report" "$@"
status=$?
set -e
if [ -s "$report" ]; then
  node -e "
    const r = require('./$report');
    console.log(r.numPassedTests + ' passed, ' + r.numFailedTests + ' failed');
    process.exit(r.numFailedTests > 0 || !r.success ? 1 : 0);
  " || status=1
  if [ "$status" -ne 0 ]; then
    echo "test: vitest exited with status $status (a failed test, a suite that did not load, or an error outside a test; see above)"
  fi
else
  echo "0 passed, 0 failed (vitest wrote no report; exit status $status)"
  [ "$status" -ne 0 ] || status=1
fi
if [ "$web_build_ok" -eq 0 ]; then
  echo "test: failed because the web app did not build"
  status=1
fi
exit "$status"
