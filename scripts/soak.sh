#!/usr/bin/env bash
# npm run soak: 60 s of mixed load at 50 connections against the bench database (see bench/soak.ts).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_deps
bash scripts/db.sh up
export DATABASE_URL="$(bash scripts/db.sh url isobath_bench)"
exec node_modules/.bin/tsx bench/soak.ts
