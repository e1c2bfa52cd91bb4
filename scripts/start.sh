#!/usr/bin/env bash
# `npm start`: the product with demo data on http://127.0.0.1:3000.
# Installs and starts the `dev` MariaDB when needed, migrates, seeds, builds the
# app when the sources changed, and serves it in the foreground (Ctrl-C stops
# the web server; `npm run db -- stop dev` stops the database).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
export PATH="/usr/sbin:$PATH"

bash scripts/db.sh start dev
export NUXT_DATABASE_URL="${NUXT_DATABASE_URL:-$(bash scripts/db.sh url dev)}"
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts

stamp=.output/nitro.json
if [ ! -f "$stamp" ] || [ -n "$(find app server shared public nuxt.config.ts tailwind.config.ts package-lock.json -newer "$stamp" -print -quit 2>/dev/null)" ]; then
  echo "building the app…"
  npx nuxt build >/dev/null
fi

if [ -z "${NUXT_SESSION_PASSWORD:-}" ]; then
  echo "WARNING: NUXT_SESSION_PASSWORD is not set; using the development default. Set a secret of 32+ characters in production." >&2
  export NUXT_SESSION_PASSWORD="plumbline-development-only-session-secret"
fi
export HOST="${HOST:-127.0.0.1}" PORT="${PORT:-3000}"
echo "Plumbline on http://$HOST:$PORT (demo sign-ins are in README.md)"
export PLUMBLINE_APP_URL="${PLUMBLINE_APP_URL:-http://$HOST:$PORT}"
# Mail: unless an SMTP server is named (PLUMBLINE_SMTP_HOST), a local catcher on
# loopback takes every message; admins read them on the Outbox page.
catcher_pid=""
if [ -z "${PLUMBLINE_SMTP_HOST:-}" ]; then
  export PLUMBLINE_SMTP_HOST=127.0.0.1 PLUMBLINE_SMTP_PORT="${PLUMBLINE_SMTP_PORT:-2525}"
  export PLUMBLINE_CATCHER_PORT="${PLUMBLINE_CATCHER_PORT:-2527}"
  export PLUMBLINE_CATCHER_URL="http://127.0.0.1:$PLUMBLINE_CATCHER_PORT"
  node --import tsx scripts/mail-catcher.ts &
  catcher_pid=$!
fi
# The job worker computes reference sets off the web server's request thread and sends the mail outbox.
node --import tsx scripts/worker.ts &
worker_pid=$!
node .output/server/index.mjs &
server_pid=$!
trap 'kill "$worker_pid" "$server_pid" $catcher_pid 2>/dev/null || true' EXIT
for _ in $(seq 1 100); do curl -fsS "http://$HOST:$PORT/api/health" >/dev/null 2>&1 && break; sleep 0.2; done
# Demo reference sets and runs, through the server's own API (idempotent).
npx tsx scripts/seed-runs.ts "http://$HOST:$PORT" || echo "WARNING: the demo runs could not be made; the app is running without them" >&2
npx tsx scripts/seed-release.ts "http://$HOST:$PORT" || echo "WARNING: the demo deviation and sign-off could not be made" >&2
wait "$server_pid"
