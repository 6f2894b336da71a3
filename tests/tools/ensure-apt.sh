#!/usr/bin/env bash
# Installs Debian packages the tests drive (a peer library, tmux) when they are missing.
# Usage: ensure-apt.sh PACKAGE [PACKAGE...]; exit 0 when all are installed afterwards.
set -u
missing=()
for p in "$@"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
[ ${#missing[@]} -eq 0 ] && exit 0
if [ "$(id -u)" -ne 0 ]; then
  echo "missing Debian packages: ${missing[*]} (run as root, or: sudo apt-get install ${missing[*]})" >&2
  exit 1
fi
# One process at a time: parallel test classes may ask together.
exec 9>/tmp/stratlink-ensure-apt.lock
flock 9
export DEBIAN_FRONTEND=noninteractive
apt-get install -y -qq "${missing[@]}" >/dev/null 2>&1 || { apt-get update -qq >/dev/null 2>&1; apt-get install -y -qq "${missing[@]}" >/dev/null; }
