#!/usr/bin/env bash
# Prints the path of a headless-capable Chromium, installing Debian's chromium package with apt-get when none is found
# (needs root). Used by tools/render-report.sh and tools/print-report.sh.
set -euo pipefail
browser=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$browser" ]; then
  echo "chromium not found; installing Debian's chromium package" >&2
  apt-get update -qq >&2
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  browser=$(command -v chromium)
fi
echo "$browser"
