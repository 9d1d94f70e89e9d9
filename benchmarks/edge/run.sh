#!/usr/bin/env bash
# Times `solve` of the edge-of-limit buildings (make_buildings.py) with the Release build: wall and CPU time, peak memory.
# From the repository root: bash benchmarks/edge/run.sh [DIR]
set -euo pipefail
dir=${1:-/tmp/plan-edge}
dotnet build -c Release src/PlaneLateral.Cli -v q >/dev/null
python3 benchmarks/edge/make_buildings.py "$dir"
for m in frames-edge walls-edge; do
  /usr/bin/time -f "$m: %e s wall, %U s user, %M KiB peak, exit %x" \
    src/PlaneLateral.Cli/bin/Release/net10.0/planelateral solve "$dir/$m.json" --out "$dir/$m" --detail summary >/dev/null
done
uptime
