#!/usr/bin/env bash
# Installs what Kerf needs on a Debian machine when it is missing: npm packages, PostgreSQL's
# server binaries, OpenStack Swift with memcached (the S3 stand-in) and Debian's Chromium (the
# server's results cards, and the browser tests).
set -euo pipefail
cd "$(dirname "$0")/.."

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    echo "kerf: '$*' needs root; run it once as root, then try again." >&2; exit 1; fi
}

apt_updated=0
apt_install() {
  [ $apt_updated = 1 ] || { echo "kerf: apt-get update…"; as_root apt-get update -q >/dev/null; apt_updated=1; }
  local names=() arg
  for arg in "$@"; do [[ $arg == -* ]] || names+=("$arg"); done
  echo "kerf: installing Debian's ${names[*]}…"
  DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -q "$@" >/dev/null
}

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "kerf: installing npm packages…"
  npm ci --no-audit --no-fund --loglevel=error
fi

if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
  apt_install postgresql
fi

# The server makes each clip's poster and proxy with Debian's ffmpeg and ffprobe (one package, about
# 92 with what it needs); npm's ffmpeg packages download a binary at install or ship an old build.
if ! command -v ffmpeg >/dev/null || ! command -v ffprobe >/dev/null; then
  apt_install ffmpeg
fi

# The S3 stand-in: Swift's four servers (its proxy carries the S3 layer) and memcached for its tokens.
# Without --no-install-recommends apt pulls about 145 packages instead of 64.
missing=0
for command in swift-proxy-server swift-account-server swift-container-server swift-object-server memcached; do
  command -v "$command" >/dev/null || missing=1
done
if [ $missing = 1 ]; then
  apt_install --no-install-recommends swift-proxy swift-account swift-container swift-object memcached
fi

# The calendar feed's tests read each feed back with Python's icalendar, a parser Kerf did not write.
if ! /usr/bin/python3 -c "import icalendar" >/dev/null 2>&1; then
  apt_install --no-install-recommends python3-icalendar
fi

# The server draws results cards with it, and the browser tests run in it.
if ! command -v chromium >/dev/null; then
  apt_install chromium
fi
