# Shared helpers for the project's scripts. Sourced, not run.
# Everything the scripts start listens on 127.0.0.1 only.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export ROOT
# ISOBATH_PG_PORT, when set, fixes the PostgreSQL port; otherwise scripts/db.sh keeps the one it chose.

log() { printf '\033[36m[isobath]\033[0m %s\n' "$*" >&2; }

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; elif command -v sudo >/dev/null 2>&1; then sudo "$@"; else
    log "need root to run: $*"; return 1; fi
}

apt_install() {
  log "installing from Debian's packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

# Install node_modules when missing or older than the lockfile.
ensure_deps() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    log "installing dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund)
  fi
}

# Build the client when dist/ is missing or older than any client source.
ensure_client_build() {
  local stamp="$ROOT/dist/index.html"
  # Always the production build: Vite takes NODE_ENV from the environment, and npm start
  # (development by default) or npm test (test) would otherwise ship React's development build,
  # half again as large and slower. A build made before this rule has no marker and is redone.
  if [ ! -f "$stamp" ] || [ ! -f "$ROOT/dist/.production-build" ] || [ -n "$(cd "$ROOT" && find src shared index.html vite.config.ts tailwind.config.ts public -newer "$stamp" -print -quit 2>/dev/null)" ]; then
    log "building the client"
    (cd "$ROOT" && NODE_ENV=production npx vite build --logLevel warn && touch dist/.production-build)
  fi
}

# Start the fake S3 and SMTP servers in the background and export what the app needs
# (S3_ENDPOINT, SMTP_HOST, SMTP_PORT, MAIL_CATCHER_DIR). Sets FAKES_PID.
start_fakes() {
  local ready="$ROOT/.data/fakes.ready"
  mkdir -p "$ROOT/.data"; rm -f "$ready"
  (cd "$ROOT" && exec node_modules/.bin/tsx scripts/fakes/index.ts >"$ready" 2>"$ROOT/.data/fakes.log") &
  FAKES_PID=$!
  for _ in $(seq 1 100); do
    grep -q 'fakes ready' "$ready" 2>/dev/null && break
    kill -0 "$FAKES_PID" 2>/dev/null || { log "the fake S3/SMTP servers did not start:"; cat "$ROOT/.data/fakes.log" >&2; exit 1; }
    sleep 0.1
  done
  local line
  line=$(grep 'fakes ready' "$ready")
  for pair in $(echo "${line#*ready: }"); do export "${pair?}"; done
  log "fake S3 at $S3_ENDPOINT and SMTP catcher at $SMTP_HOST:$SMTP_PORT (mail saved in $MAIL_CATCHER_DIR)"
}
