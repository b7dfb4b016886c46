#!/usr/bin/env bash
# Shared set-up steps for scripts/start.sh and scripts/test.sh (sourced, not run):
#   ensure_node_deps     npm ci when node_modules is missing or was installed from another package-lock.json
#   ensure_web_build     expo web export into dist/ when the app's sources changed since the last build
#   ensure_session_secret  SESSION_SECRET from the environment or .data/session-secret (made once)
#   ensure_local_secrets   PAY_API_KEY and PAY_WEBHOOK_SECRET for the local payment fake, from the environment
#                          or .data/ (made once), shared by the fake, the API and the worker

setup_log() { echo "setup: $*" >&2; }

lock_digest() { sha256sum package-lock.json | cut -d' ' -f1; }

ensure_node_deps() {
  local stamp=node_modules/.sheetsmith-lock.sha256
  if [ -d node_modules ] && [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$(lock_digest)" ]; then return 0; fi
  # A tree installed before this stamp existed counts as current when npm's own record is newer than the lock.
  if [ -d node_modules ] && [ ! -f "$stamp" ] && [ node_modules/.package-lock.json -nt package-lock.json ]; then
    lock_digest > "$stamp"
    return 0
  fi
  setup_log "installing npm packages (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
  lock_digest > "$stamp"
}

# Everything the exported web bundle is built from; a change to any of these makes dist/ stale.
WEB_SOURCES=(app components hooks public geometry app.json package-lock.json tsconfig.json db/validation.ts)

web_sources_digest() {
  local present=()
  local p
  for p in "${WEB_SOURCES[@]}"; do [ -e "$p" ] && present+=("$p"); done
  find "${present[@]}" -type f -not -name '.DS_Store' -print0 | LC_ALL=C sort -z | xargs -0 sha256sum | sha256sum | cut -d' ' -f1
}

# Builds dist/ when stale. On a failed build the old dist/ (if any) stays and the server keeps serving it, or
# answers "web app not built"; the log says why.
ensure_web_build() {
  if [ "${SHEETSMITH_SKIP_WEB_BUILD:-}" = 1 ]; then
    setup_log "SHEETSMITH_SKIP_WEB_BUILD=1: leaving dist/ as it is"
    return 0
  fi
  if [ ! -f app/_layout.tsx ] && [ ! -f app/_layout.jsx ]; then
    setup_log "no app/_layout.tsx yet: skipping the web build (the server answers 503 'web app not built')"
    return 0
  fi
  local digest
  digest=$(web_sources_digest)
  if [ -f dist/index.html ] && [ "$(cat dist/.build-hash 2>/dev/null)" = "$digest" ]; then return 0; fi
  mkdir -p .data/logs
  setup_log "building the web app into dist/ (a cold build takes a few minutes; later ones are quick)"
  if npm run -s web:build >.data/logs/web-build.log 2>&1; then
    echo "$digest" > dist/.build-hash
    setup_log "web app built"
  else
    setup_log "the web build failed; see .data/logs/web-build.log (last lines below)"
    tail -n 15 .data/logs/web-build.log >&2
    return 1
  fi
}

ensure_session_secret() {
  if [ -n "${SESSION_SECRET:-}" ]; then export SESSION_SECRET; return 0; fi
  if [ ! -s .data/session-secret ]; then
    mkdir -p .data
    (umask 077 && head -c 48 /dev/urandom | base64 | tr -d '\n=' | tr '+/' '-_' > .data/session-secret && echo >> .data/session-secret)
  fi
  SESSION_SECRET=$(tr -d '\n' < .data/session-secret)
  export SESSION_SECRET
}

# Prints the content of .data/<name>, making it first from 48 random bytes when missing (readable by us only).
local_secret() {
  local file=".data/$1"
  if [ ! -s "$file" ]; then
    mkdir -p .data
    (umask 077 && head -c 48 /dev/urandom | base64 | tr -d '\n=' | tr '+/' '-_' > "$file" && echo >> "$file")
  fi
  tr -d '\n' < "$file"
}

ensure_local_secrets() {
  PAY_API_KEY="${PAY_API_KEY:-$(local_secret pay-api-key)}"
  PAY_WEBHOOK_SECRET="${PAY_WEBHOOK_SECRET:-$(local_secret pay-webhook-secret)}"
  export PAY_API_KEY PAY_WEBHOOK_SECRET
}
