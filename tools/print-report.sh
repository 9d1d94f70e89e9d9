#!/usr/bin/env bash
# Prints a PlaneLateral HTML report to PDF with headless Chromium, as a checker would print it to paper (the report's
# @media print style: each section on a new page, rows and figures kept whole, table headers repeated).
# Beside CI, not in it: the test command never needs a browser. Installs Debian's chromium with apt-get when missing
# (needs root).
#
#   tools/print-report.sh [REPORT.html] [OUT.pdf]
#
# Without arguments: writes the demo's report (models/demo-clinic.json) to a scratch folder with the built CLI
# (dotnet run), prints it to report.pdf beside it and says the PDF's size and page count.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
report=${1:+$(realpath -m "$1")}
out=${2:+$(realpath -m "$2")}
cd "$here/.."

if [ -z "$report" ]; then
  scratch=$(mktemp -d)
  dotnet run --project src/PlaneLateral.Cli -v q -- report models/demo-clinic.json --out "$scratch/report" >/dev/null
  report="$scratch/report/report.html"
fi
if [ ! -f "$report" ]; then
  echo "print-report: no such file: $report" >&2
  exit 1
fi
out=${out:-${report%.html}.pdf}

browser=$("$here/find-chromium.sh")

profile=$(mktemp -d)
trap 'rm -rf "$profile"' EXIT
# A bounded run: a browser that hangs is stopped after 120 s rather than holding the shell.
timeout 120 "$browser" --headless --no-sandbox --disable-gpu --disable-background-networking --disable-component-update \
  --disable-sync --no-first-run --user-data-dir="$profile" --no-pdf-header-footer \
  --print-to-pdf="$out" "file://$report" 2>/dev/null
if [ ! -s "$out" ]; then
  echo "print-report: no PDF written" >&2
  exit 1
fi
# Page count: the page objects of the PDF (ISO 32000-1 §7.7.3.3, /Type /Page).
pages=$(grep -a -o '/Type */Page\b' "$out" | wc -l)
echo "print-report: wrote $out ($(stat -c %s "$out") bytes, $pages pages)"
