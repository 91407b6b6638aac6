#!/usr/bin/env bash
# npm start: prepare everything on a fresh clone, then serve http://localhost:${PORT:-3000}.
# Outside production, a fake S3 server and a fake SMTP catcher start beside the app on
# 127.0.0.1 (unless S3_ENDPOINT / SMTP_HOST point elsewhere) and stop with it.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
bash scripts/db.sh up
export DATABASE_URL="${DATABASE_URL:-$(bash scripts/db.sh url isobath)}"
export NODE_ENV="${NODE_ENV:-development}"

FAKES_PID=""
cleanup() { [ -n "$FAKES_PID" ] && kill "$FAKES_PID" 2>/dev/null && wait "$FAKES_PID" 2>/dev/null; true; }
trap cleanup EXIT
if [ "$NODE_ENV" != production ] && [ -z "${S3_ENDPOINT:-}" ]; then
  start_fakes
fi

# Migrate and seed (the demo project's sign-off sends its mail to the catcher started above).
node_modules/.bin/tsx server/db/cli.ts setup
ensure_client_build

# Node flags for the server live in package.json (config.serverNodeFlags): a 16 MB young
# generation, so an evaluation's short-lived objects die young instead of being collected every
# few requests (see the README's Performance; the bench starts the server with the same flags).
NODE_FLAGS=$(node -p "require('./package.json').config.serverNodeFlags")
# shellcheck disable=SC2086
node $NODE_FLAGS --import tsx server/index.ts &
APP_PID=$!
trap 'kill -TERM "$APP_PID" 2>/dev/null' INT TERM
wait "$APP_PID" || true
wait "$APP_PID" 2>/dev/null || true
