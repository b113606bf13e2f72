#!/usr/bin/env bash
# Shared helpers for the start, test and dev scripts. Sourced, never run.
# Everything here installs only what is missing, so a second run is fast.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export ROOT
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[2m[gelwright]\033[0m %s\n' "$*"; }

# Load an optional env file; every setting has a default, so none is required.
load_env() {
  if [ -f "$ROOT/.env" ]; then
    set -a
    # shellcheck disable=SC1091
    . "$ROOT/.env"
    set +a
  fi
}

apt_install() {
  # apt_install PACKAGE... : installs Debian packages that are not yet present.
  local missing=()
  for p in "$@"; do
    dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  if [ "$(id -u)" -ne 0 ] && ! command -v sudo >/dev/null 2>&1; then
    log "Missing Debian packages: ${missing[*]}. Install them as root: apt-get install -y ${missing[*]}"
    exit 1
  fi
  local SUDO=""
  [ "$(id -u)" -ne 0 ] && SUDO="sudo"
  log "Installing Debian packages: ${missing[*]}"
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
}

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.package-lock.json"
  if [ ! -d "$ROOT/node_modules" ] || [ ! -f "$stamp" ] || [ "$ROOT/package-lock.json" -nt "$stamp" ]; then
    log "Installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}
