#!/usr/bin/env bash
# Times `solve` of the edge-of-limit buildings (make_buildings.py) and wall panels (make_panels.py: one panel at the
# 40 000-node mesh ceiling under 200 load cases, and two under 100, each 8·10⁶ panel mesh entries, the limit) with the
# Release build: wall and CPU time, peak memory. The panel runs write about 0.9 GB of panel-stresses.csv each.
# From the repository root: bash benchmarks/edge/run.sh [DIR]
set -euo pipefail
dir=${1:-/tmp/plan-edge}
dotnet build -c Release src/PlaneLateral.Cli -v q >/dev/null
python3 benchmarks/edge/make_buildings.py "$dir"
for m in frames-edge walls-edge; do
  /usr/bin/time -f "$m: %e s wall, %U s user, %M KiB peak, exit %x" \
    src/PlaneLateral.Cli/bin/Release/net10.0/planelateral solve "$dir/$m.json" --out "$dir/$m" --detail summary >/dev/null
done
for edge in "1 200" "2 100"; do
  set -- $edge
  python3 benchmarks/edge/make_panels.py "$dir/panels-$1x$2" "$1" "$2"
  /usr/bin/time -f "panels $1 x $2 cases: %e s wall, %U s user, %M KiB peak, exit %x" \
    src/PlaneLateral.Cli/bin/Release/net10.0/planelateral solve "$dir/panels-$1x$2/panels-edge.json" --out "$dir/panels-$1x$2/out" --detail summary >/dev/null
  rm -rf "$dir/panels-$1x$2/out"
done
uptime
