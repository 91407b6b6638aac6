#!/usr/bin/env bash
# npm run bench: its own database (isobath_bench) with a 2,000-set synthetic catalogue, the real
# server on a free loopback port, autocannon and Debian's chromium. Writes bench/results.json and
# exits non-zero when a budget is missed. BENCH_SECONDS shortens the load runs (default 15).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
[ -x /usr/bin/chromium ] || apt_install chromium
bash scripts/db.sh up
ensure_client_build
export DATABASE_URL="$(bash scripts/db.sh url isobath_bench)"
exec node_modules/.bin/tsx bench/run.ts
