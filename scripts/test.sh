#!/usr/bin/env bash
# npm test: the same preparation as npm start with its own database, then every test:
# unit, API (real PostgreSQL) and browser (Debian's chromium). Extra arguments go to vitest.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
[ -x /usr/bin/chromium ] || apt_install chromium
/usr/bin/python3 -c 'import gsw' 2>/dev/null || apt_install python3-gsw
bash scripts/db.sh up
export DATABASE_URL="$(bash scripts/db.sh url isobath_test)"
export NODE_ENV=test
ensure_client_build
exec node_modules/.bin/vitest run "$@"
