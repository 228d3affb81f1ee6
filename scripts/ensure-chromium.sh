#!/usr/bin/env bash
# Makes sure Debian's Chromium is installed for the browser tests (playwright-core drives /usr/bin/chromium).
set -euo pipefail
if [ -x /usr/bin/chromium ]; then
  exit 0
fi
if [ "$(id -u)" != "0" ]; then
  echo "ensure-chromium: /usr/bin/chromium is missing; install it with: sudo apt-get install -y chromium" >&2
  exit 1
fi
log="$(mktemp -t chromium-install.XXXXXX.log)"
echo "ensure-chromium: installing Debian's chromium with apt-get (about a minute; log: $log)"
export DEBIAN_FRONTEND=noninteractive
if ! { apt-get update -qq && apt-get install -y -qq chromium; } >"$log" 2>&1; then
  echo "ensure-chromium: apt-get failed; last lines of $log:" >&2
  tail -n 20 "$log" >&2
  exit 1
fi
echo "ensure-chromium: installed $(/usr/bin/chromium --version 2>/dev/null | tail -n 1)"
