#!/usr/bin/env bash
# npm test: the lint (import boundaries) and the typecheck, then the same preparation as
# npm start with its own database, then every test: unit, API (real PostgreSQL) and browser
# (Debian's chromium). Any lint or type error fails the run before PostgreSQL starts.
# Extra arguments go to vitest.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
log "lint: eslint ."
node_modules/.bin/eslint .
log "typecheck: tsc --noEmit -p tsconfig.json"
node_modules/.bin/tsc --noEmit -p tsconfig.json
[ -x /usr/bin/chromium ] || apt_install chromium
/usr/bin/python3 -c 'import gsw' 2>/dev/null || apt_install python3-gsw
bash scripts/db.sh up
export DATABASE_URL="$(bash scripts/db.sh url isobath_test)"
export NODE_ENV=test
ensure_client_build
exec node_modules/.bin/vitest run "$@"
