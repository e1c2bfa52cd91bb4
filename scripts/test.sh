#!/usr/bin/env bash
# `npm test`: everything. Installs what is missing (Debian's MariaDB, Chromium,
# python3-mpmath), starts a fresh `test` MariaDB, migrates and seeds it, builds
# the app, serves it on 127.0.0.1:3100 with a job worker and a local SMTP
# catcher (SMTP 2526, messages on 2528), runs the unit, API and browser projects,
# and prints one closing line: `N passed, N failed`.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
# One run at a time per checkout: runs share the test database and port.
mkdir -p .data
exec 8>.data/test.lock
flock 8
export NO_COLOR=1
export PATH="/usr/sbin:$PATH"

bash scripts/ensure-debian.sh mariadb-server mariadb-client chromium fonts-liberation python3-mpmath python3-gmpy2 poppler-utils

bash scripts/db.sh reset test >/dev/null
export NUXT_DATABASE_URL="$(bash scripts/db.sh url test)"
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts

mkdir -p test-results
if [ "${PLUMBLINE_SKIP_BUILD:-0}" != 1 ] || [ ! -f .output/server/index.mjs ]; then
  npx nuxt build >test-results/build.log 2>&1 || { tail -40 test-results/build.log; exit 1; }
fi

mkdir -p test-results
port="${PLUMBLINE_TEST_PORT:-3100}"
export PLUMBLINE_TEST_URL="http://127.0.0.1:$port"
if curl -fsS -o /dev/null "$PLUMBLINE_TEST_URL/" 2>/dev/null; then
  echo "port $port is already in use; stop what runs there or set PLUMBLINE_TEST_PORT" >&2
  exit 1
fi
# Mail: a local SMTP catcher on loopback (test ports); the worker retries quickly here.
export PLUMBLINE_SMTP_HOST=127.0.0.1 PLUMBLINE_SMTP_PORT="${PLUMBLINE_TEST_SMTP_PORT:-2526}"
catcher_port="${PLUMBLINE_TEST_CATCHER_PORT:-2528}"
export PLUMBLINE_CATCHER_URL="http://127.0.0.1:$catcher_port" PLUMBLINE_APP_URL="$PLUMBLINE_TEST_URL"
export PLUMBLINE_MAIL_RETRY_BASE_MS=300 PLUMBLINE_MAIL_RETRY_MAX_MS=1500 PLUMBLINE_MAIL_MAX_ATTEMPTS=60
rm -rf test-results/mail-catcher
PLUMBLINE_CATCHER_PORT="$catcher_port" PLUMBLINE_CATCHER_DIR=test-results/mail-catcher \
  setsid node --import tsx scripts/mail-catcher.ts </dev/null >test-results/mail-catcher.log 2>&1 8>&- &
catcher_pid=$!
NUXT_SESSION_PASSWORD="plumbline-test-session-password-0123456789" \
NUXT_TRUST_PROXY=true HOST=127.0.0.1 PORT="$port" \
  setsid node .output/server/index.mjs </dev/null >test-results/server.log 2>&1 8>&- &
server_pid=$!
setsid node --import tsx scripts/worker.ts </dev/null >test-results/worker.log 2>&1 8>&- &
worker_pid=$!
cleanup() {
  kill -- -"$server_pid" 2>/dev/null || kill "$server_pid" 2>/dev/null || true
  kill -- -"$worker_pid" 2>/dev/null || kill "$worker_pid" 2>/dev/null || true
  kill -- -"$catcher_pid" 2>/dev/null || kill "$catcher_pid" 2>/dev/null || true
  [ "${PLUMBLINE_KEEP_DB:-0}" = 1 ] || bash scripts/db.sh stop test >/dev/null 2>&1 || true
}
trap cleanup EXIT
for _ in $(seq 1 100); do
  curl -fsS "$PLUMBLINE_TEST_URL/api/health" >/dev/null 2>&1 && break
  sleep 0.2
done
curl -fsS "$PLUMBLINE_TEST_URL/api/health" >/dev/null || { echo "the test server did not start:"; tail -30 test-results/server.log; exit 1; }
for _ in $(seq 1 50); do curl -fsS "$PLUMBLINE_CATCHER_URL/health" >/dev/null 2>&1 && break; sleep 0.2; done
curl -fsS "$PLUMBLINE_CATCHER_URL/health" >/dev/null || { echo "the mail catcher did not start:"; tail -30 test-results/mail-catcher.log; exit 1; }

status=0
npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json "$@" || status=$?
node scripts/test-summary.mjs test-results/vitest.json || status=1
exit "$status"
