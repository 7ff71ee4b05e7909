#!/usr/bin/env bash
# Debian's chromium for the browser tests (tests/PlanDesk.Browser.Tests). Playwright drives it from
# /usr/bin/chromium and never downloads a browser of its own. Idempotent and quiet when chromium is there.
set -euo pipefail
if [ -x /usr/bin/chromium ]; then
  exit 0
fi
export DEBIAN_FRONTEND=noninteractive
sudo_if_needed() { if [ "$(id -u)" -eq 0 ]; then "$@"; else sudo "$@"; fi; }
sudo_if_needed apt-get update -qq >/dev/null
sudo_if_needed apt-get install -y -qq chromium fonts-dejavu-core fonts-liberation >/dev/null
[ -x /usr/bin/chromium ] || { echo "setup-chromium: /usr/bin/chromium still missing after apt-get install chromium" >&2; exit 1; }
