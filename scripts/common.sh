# Shared steps of scripts/demo.sh and scripts/test.sh. Sourced, not run.
# Every step is idempotent: it does nothing when its work is already done.

# Next.js would report build telemetry to its server; the scripts never phone home.
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[1m[gyrolux]\033[0m %s\n' "$*" >&2; }

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi
}

# Installs node_modules from the lock file when missing or older than the lock.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing dependencies (npm ci)"
    # --include=dev: the scripts export NODE_ENV=production, which would otherwise drop the
    # build and test tools.
    npm ci --include=dev --no-audit --no-fund
  fi
}

# Debian's Chromium for the browser tests; never a downloaded browser.
ensure_chromium() {
  if [ ! -x "${GYROLUX_CHROMIUM:-/usr/bin/chromium}" ]; then
    log "installing Debian's chromium"
    as_root apt-get update -qq
    as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  fi
}

# A long random secret kept beside the data dir of this checkout, so sessions survive restarts.
ensure_auth_secret() {
  if [ -z "${AUTH_SECRET:-}" ]; then
    # Readable by this user only: whoever holds the secret can forge any session cookie.
    mkdir -p -m 700 .data
    [ -s .data/auth-secret ] || (umask 077 && node -e 'process.stdout.write(require("node:crypto").randomBytes(32).toString("base64url"))' > .data/auth-secret)
    chmod 600 .data/auth-secret
    AUTH_SECRET="$(cat .data/auth-secret)"
    export AUTH_SECRET
  fi
  export AUTH_TRUST_HOST=true
}

# Waits until the web server answers /api/health (any status: 503 still means the server is up).
wait_for_http() {
  local url="$1" tries="${2:-120}"
  for _ in $(seq "$tries"); do
    if node -e 'fetch(process.argv[1]).then(() => process.exit(0), () => process.exit(1))' "$url"; then return 0; fi
    sleep 0.5
  done
  log "no answer from $url"
  return 1
}

# A fingerprint of everything the production build is made from (sources, lock file, config), so
# `npm run demo` can skip `next build` when nothing changed since the last one.
build_fingerprint() {
  {
    find app components lib workers db public types proxy.ts next.config.mjs package-lock.json \
      tailwind.config.ts postcss.config.mjs tsconfig.json -type f -print0 2>/dev/null | LC_ALL=C sort -z | xargs -0 sha256sum
    echo "distDir=${GYROLUX_NEXT_DIST_DIR:-.next}"
  } | sha256sum | cut -d' ' -f1
}

# DATABASE_URL as the lab-run workers log in: their own least-privilege role (db/pg.sh worker-role,
# db/worker-role.sql) over TLS, checked against the certificate db/pg.sh made for 127.0.0.1.
worker_database_url() {
  local rest="${DATABASE_URL#*://}"
  rest="${rest#*@}"
  printf 'postgres://gyrolux_worker:%s@%s?sslmode=verify-full&sslrootcert=%s.crt' \
    "${GYROLUX_WORKER_DB_PASSWORD:-gyrolux-worker}" "${rest%%\?*}" "$GYROLUX_PG_DATA"
}
