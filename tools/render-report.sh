#!/usr/bin/env bash
# Renders a PlaneLateral HTML report to a PNG screenshot with headless Chromium, to look at it as a reader would.
# Not used by CI. Installs Debian's chromium with apt-get when it is missing (needs root).
#
#   tools/render-report.sh REPORT.html [OUT.png] [WIDTHxHEIGHT]
#
# Default OUT.png: beside the report, REPORT.png; default size 1100x6000 (tall enough for a whole demo report).
set -euo pipefail

if [ $# -lt 1 ]; then
  echo "usage: tools/render-report.sh REPORT.html [OUT.png] [WIDTHxHEIGHT]" >&2
  exit 1
fi
report=$(realpath "$1")
out=${2:-"${report%.html}.png"}
size=${3:-1100x6000}
if [ ! -f "$report" ]; then
  echo "render-report: no such file: $1" >&2
  exit 1
fi

browser=$("$(cd "$(dirname "$0")" && pwd)/find-chromium.sh")

out_abs=$(realpath -m "$out")
"$browser" --headless --no-sandbox --disable-gpu --disable-background-networking --no-first-run \
  --hide-scrollbars --window-size="${size/x/,}" --screenshot="$out_abs" "file://$report" 2>/dev/null
echo "render-report: wrote $out_abs"
