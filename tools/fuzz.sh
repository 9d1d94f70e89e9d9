#!/usr/bin/env bash
# Fuzzes the model reader (and the solve, compare and render steps behind it) for a bounded time.
#   tools/fuzz.sh [seconds per property]      default 60; three properties, so about three times that plus the build.
# CsCheck (property-based, already a test dependency) runs each property of tests/PlaneLateral.Core.Tests/Fuzz/
# ReaderFuzzCampaign.cs for the given time on every core: structural mutations of the JSON tree (integer keys given
# numbers wider than 64 bits, fractions and negatives among them), text edits, and the lenient-JSON forms (leading
# zeros, hexadecimal, single quotes, unquoted keys, trailing commas, NUL bytes, NaN/Infinity), which must be refused. A failure prints the shrunk input and the seed to replay it
# (CsCheck_Seed=...); keep every finding as a case in tests/corpus/bad (tests/corpus/make-bad.py). See docs/hardening.md.
set -euo pipefail
cd "$(dirname "$0")/.."
seconds="${1:-60}"
if ! [[ "$seconds" =~ ^[0-9]+$ ]] || (( seconds < 1 || seconds > 1800 )); then
  echo "usage: tools/fuzz.sh [seconds per property, 1..1800]" >&2
  exit 2
fi
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
# Built first, outside the hard stop: on a loaded machine the build alone took most of the stop's margin.
dotnet build tests/PlaneLateral.Core.Tests -v q 2>&1 | tail -n 3
# A hard stop well beyond the budget, in case one input hangs (that would itself be a finding).
limit=$(( 3 * seconds + 600 ))
PLANELATERAL_FUZZ_SECONDS="$seconds" timeout "$limit" \
  dotnet test tests/PlaneLateral.Core.Tests --no-build --filter "FullyQualifiedName~ReaderFuzzCampaign" --logger "console;verbosity=detailed" 2>&1 \
  | grep -Ev '^\s*$' | tail -n 40
exit "${PIPESTATUS[0]}"
