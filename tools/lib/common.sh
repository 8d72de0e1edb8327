# Shared helpers for ./tools/start and ./tools/test: logging, root access and install-if-missing.
# Sourced, never run; callers set LIMBUS_ROOT first.

LIMBUS_PNPM_VERSION=12.4.2

log() { printf '[limbus] %s\n' "$*" >&2; }
die() {
  printf '[limbus] error: %s\n' "$*" >&2
  exit 1
}

# Installing system packages needs root; a developer's machine may offer sudo instead.
as_root() {
  if [ "$(id -u)" -eq 0 ]; then
    "$@"
  elif command -v sudo >/dev/null 2>&1; then
    sudo "$@"
  else
    die "need root (or sudo) to run: $*"
  fi
}

_apt_updated=0
apt_install() {
  if [ "$_apt_updated" -eq 0 ]; then
    log "apt-get update"
    as_root env DEBIAN_FRONTEND=noninteractive apt-get update -q >&2
    _apt_updated=1
  fi
  log "apt-get install $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends "$@" >&2
}

# ensure_commands "command:debian-package" ...: installs each package whose command is absent,
# so a second run (or a machine that already has them) does nothing.
ensure_commands() {
  local missing=() pair command package
  for pair in "$@"; do
    command="${pair%%:*}"
    package="${pair#*:}"
    if ! command -v "$command" >/dev/null 2>&1 && [ ! -x "/usr/sbin/$command" ]; then
      missing+=("$package")
    fi
  done
  if [ "${#missing[@]}" -gt 0 ]; then
    apt_install "${missing[@]}"
  fi
}

# mariadbd lives in /usr/sbin, which is not on every user's PATH.
mariadbd_bin() {
  if command -v mariadbd >/dev/null 2>&1; then command -v mariadbd; else echo /usr/sbin/mariadbd; fi
}

ensure_pnpm() {
  local current=''
  if command -v pnpm >/dev/null 2>&1; then current="$(pnpm --version 2>/dev/null || true)"; fi
  if [ "$current" != "$LIMBUS_PNPM_VERSION" ]; then
    log "installing pnpm $LIMBUS_PNPM_VERSION (found '${current:-none}')"
    as_root npm i -g -E "pnpm@$LIMBUS_PNPM_VERSION" >&2
  fi
}

# Cheap when nothing changed (pnpm skips resolution when the lockfile is current), so it runs
# every time rather than guessing from timestamps.
ensure_node_modules() {
  log "pnpm install --frozen-lockfile"
  (cd "$LIMBUS_ROOT" && pnpm install --frozen-lockfile) >&2
}

# random_secret FILE: creates FILE with a fresh secret once and prints its content ever after.
random_secret() {
  local file="$1"
  if [ ! -s "$file" ]; then
    (umask 077 && node -e 'process.stdout.write(require("node:crypto").randomBytes(32).toString("hex"))' >"$file")
  fi
  cat "$file"
}
