#!/usr/bin/env bash
# npm start: prepare everything on a fresh clone, then serve http://localhost:${PORT:-3000}.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
bash scripts/db.sh up
export DATABASE_URL="${DATABASE_URL:-$(bash scripts/db.sh url isobath)}"
export NODE_ENV="${NODE_ENV:-development}"
node_modules/.bin/tsx server/db/cli.ts setup
ensure_client_build
exec node_modules/.bin/tsx server/index.ts
