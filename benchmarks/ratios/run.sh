#!/usr/bin/env bash
# Issue 19's ratios measured in one run (docs/benchmarks.md, "All of issue 19's ratios in one run"):
#   1. start-up: `solve` of the 3,780-unknown frame and the no-argument demo against a hello-world, for the ReadyToRun
#      build and the Native AOT build (wall and CPU time, pairwise, interleaved);
#   2. the supernodal solver against CHOLMOD (cholmod_bench.c beside this script) on the same Matrix Market files at
#      about 10^4, 10^5 and 10^6 unknowns: analysis + factorisation + solve, and peak memory at 10^6;
#   3. the default sweep on 2 processors against 1 (taskset), pairwise wall time, for the ReadyToRun build and the
#      Native AOT build (what `dotnet tool install` gives on x64 Linux), each run's three files compared byte for byte.
# Prints one Markdown table (target, measured ratio: median and min–max of the pairs or rounds, met or not) and the
# machine's facts. From the repository root:
#   bash benchmarks/ratios/run.sh [--quick] [--out FILE] [--skip-startup] [--skip-aot] [--skip-cholmod] [--skip-sweep]
#                                 [--no-install] [--work DIR] [--keep]
# Needs: bash, the .NET 10 SDK, python3, /usr/bin/time (GNU time), taskset, gcc and Debian's libsuitesparse-dev
# (installed with apt-get when missing and run as root, unless --no-install; otherwise part 2 is skipped).
set -euo pipefail

quick=0; out=""; skip_startup=0; skip_aot=0; skip_cholmod=0; skip_sweep=0; install=1; work=""; keep=0
while [[ $# -gt 0 ]]; do
  case "$1" in
    --quick) quick=1 ;;
    --out) out=$2; shift ;;
    --skip-startup) skip_startup=1 ;;
    --skip-aot) skip_aot=1 ;;
    --skip-cholmod) skip_cholmod=1 ;;
    --skip-sweep) skip_sweep=1 ;;
    --no-install) install=0 ;;
    --work) work=$2; shift ;;
    --keep) keep=1 ;;
    -h|--help) sed -n '2,14p' "$0"; exit 0 ;;
    *) echo "unknown option $1 (see --help)" >&2; exit 2 ;;
  esac
  shift
done

[[ -f PlaneLateral.sln && -d src/PlaneLateral.Cli ]] || { echo "run from the repository root" >&2; exit 2; }
root=$PWD
here=$root/benchmarks/ratios
M() { python3 "$here/measure.py" "$@"; }
say() { echo "[$(date -u +%H:%M:%S)] $*" >&2; }
export DOTNET_NOLOGO=1 DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_SKIP_FIRST_TIME_EXPERIENCE=1

if [[ $quick == 1 ]]; then
  pairs=3; sweep_pairs=2; grids=(30 50 71); rounds=(2 2 1); repeat=1
else
  pairs=10; sweep_pairs=8; grids=(71 224 708); rounds=(5 3 2); repeat=2
fi
orderings=(amd metis nesdis)
procs=$(nproc)
threads=$(( procs < 2 ? procs : 2 ))

if [[ -z $work ]]; then work=$(mktemp -d "${TMPDIR:-/tmp}/ratios.XXXXXX"); fi
mkdir -p "$work"
work=$(cd "$work" && pwd)
if [[ $keep == 0 ]]; then trap 'rm -rf "$work"' EXIT; fi
notes=()
rows=()
details=()
t_start=$(date +%s)
load_before=$(cut -d' ' -f1-3 /proc/loadavg)
date_start=$(date -u '+%Y-%m-%d %H:%M UTC')

# One table row: label, "median min max count", op (le|ge), target, unit note.
row() {
  local label=$1 st=$2 op=$3 target=$4 med lo hi cnt
  read -r med lo hi cnt <<<"$st"
  local sign; [[ $op == le ]] && sign="≤" || sign="≥"
  rows+=("| $label | **$med** ($lo–$hi) | $cnt | $sign $target | $(M met "$med" "$op" "$target") |")
}

say "work folder $work"
say "building the command-line program (Release, ReadyToRun)"
dotnet build -c Release src/PlaneLateral.Cli -v q -nologo >"$work/build-cli.log" 2>&1 || { cat "$work/build-cli.log" >&2; exit 1; }
P=$root/src/PlaneLateral.Cli/bin/Release/net10.0/planelateral
if [[ $skip_startup == 0 || $skip_cholmod == 0 ]]; then
  say "building the benchmark program (Release)"
  dotnet build -c Release benchmarks/PlaneLateral.Benchmarks -v q -nologo >"$work/build-bench.log" 2>&1 || { cat "$work/build-bench.log" >&2; exit 1; }
  B=(dotnet "$root/benchmarks/PlaneLateral.Benchmarks/bin/Release/net10.0/PlaneLateral.Benchmarks.dll")
fi

# The Native AOT build, published once for the start-up rows and the sweep rows.
native=""
if [[ $skip_aot == 1 ]]; then
  notes+=("Native AOT build skipped (--skip-aot)")
elif [[ $skip_startup == 0 || $skip_sweep == 0 ]]; then
  say "publishing the Native AOT build (profile native-linux-x64)"
  if dotnet publish src/PlaneLateral.Cli -c Release -p:PublishProfile=native-linux-x64 -o "$work/native" -v q -nologo >"$work/publish-aot.log" 2>&1 \
     && [[ -x $work/native/planelateral ]]; then
    native=$work/native/planelateral
  else
    notes+=("Native AOT build skipped: \`dotnet publish -p:PublishProfile=native-linux-x64\` failed ($(grep -m1 -E 'error' "$work/publish-aot.log" | sed 's/^ *//' | cut -c1-160 || echo 'see its log'))")
  fi
fi

# ---- 1. Start-up ----------------------------------------------------------------------------------------------------
if [[ $skip_startup == 0 ]]; then
  say "start-up: hello-world, frame model, builds"
  mkdir -p "$work/hello"
  echo '<Project />' >"$work/hello/Directory.Build.props"     # nothing inherited from folders above
  echo '<Project />' >"$work/hello/Directory.Build.targets"
  (cd "$work/hello" && dotnet new console -n hello -o . --force >/dev/null && dotnet build -c Release -v q -nologo >build.log 2>&1) \
    || { cat "$work/hello/build.log" >&2; exit 1; }
  H=$work/hello/bin/Release/net10.0/hello
  frame=$work/frame.json
  "${B[@]}" frame-json 20 60 "$frame" >/dev/null
  builds=("ReadyToRun:$P")
  [[ -n $native ]] && builds+=("Native AOT:$native")
  mkdir -p "$work/demo" "$work/st"
  # one warm-up round, then $pairs rounds: each program run right after a hello-world run
  for ((i = 0; i <= pairs; i++)); do
    for b in "${builds[@]}"; do
      name=${b%%:*}; exe=${b#*:}; tag=${name// /}
      [[ $i == 0 ]] && sfx=warm || sfx=log
      M run "$work/st/hello-frame-$tag.$sfx" "$H"
      M run "$work/st/frame-$tag.$sfx" "$exe" solve "$frame" --out "$work/frame-out" || { echo "solve of the frame failed ($name)" >&2; exit 1; }
      M run "$work/st/hello-demo-$tag.$sfx" "$H"
      (cd "$work/demo" && M run "$work/st/demo-$tag.$sfx" "$exe") || { echo "the demo failed ($name)" >&2; exit 1; }
    done
  done
  for b in "${builds[@]}"; do
    name=${b%%:*}; tag=${name// /}
    for what in frame demo; do
      [[ $what == frame ]] && { target=3; desc="\`solve\` of the 3,780-unknown frame"; } || { target=5; desc="no-argument demo"; }
      for f in wall cpu; do
        [[ $f == wall ]] && fl=wall || fl="CPU (user + system)"
        row "Start-up, $desc, $name: $fl time ÷ hello-world" "$(M ratio "$work/st/$what-$tag.log" "$work/st/hello-$what-$tag.log" $f)" le $target
      done
      details+=("- $name, $what: median wall $(M median "$work/st/$what-$tag.log" wall) s, CPU $(M median "$work/st/$what-$tag.log" cpu) s; its hello-worlds $(M median "$work/st/hello-$what-$tag.log" wall) s wall, $(M median "$work/st/hello-$what-$tag.log" cpu) s CPU")
    done
  done
fi

# ---- 2. Supernodal solver against CHOLMOD ---------------------------------------------------------------------------
if [[ $skip_cholmod == 0 ]]; then
  hdr=/usr/include/suitesparse/cholmod.h
  if [[ ! -f $hdr && $install == 1 ]] && command -v apt-get >/dev/null; then
    if [[ $(id -u) == 0 ]]; then apt_get=(apt-get); elif sudo -n true 2>/dev/null; then apt_get=(sudo apt-get); else apt_get=(); fi
    if [[ ${#apt_get[@]} -gt 0 ]]; then
      say "installing libsuitesparse-dev and libopenblas-dev with apt-get"
      { "${apt_get[@]}" install -y --no-install-recommends libsuitesparse-dev libopenblas-dev \
        || { "${apt_get[@]}" update && "${apt_get[@]}" install -y --no-install-recommends libsuitesparse-dev libopenblas-dev; }; } >"$work/apt.log" 2>&1 || true
    fi
  fi
  if [[ ! -f $hdr ]]; then
    notes+=("Solver against CHOLMOD skipped: $hdr not found (\`apt-get install libsuitesparse-dev libopenblas-dev\`)")
  elif ! gcc -O2 -o "$work/cholmod_bench" "$here/cholmod_bench.c" -I/usr/include/suitesparse -lcholmod -lm 2>"$work/gcc.log"; then
    notes+=("Solver against CHOLMOD skipped: the harness did not build ($(head -1 "$work/gcc.log"))")
  else
    blas=$(ldd "$work/cholmod_bench" | awk '/libblas.so/ {print $3}')
    blas=$(readlink -f "$blas" 2>/dev/null || echo "$blas")
    C=$work/cholmod_bench
    mkdir -p "$work/mtx" "$work/sn"
    targets=(1.2 1.0 0.6)
    for k in "${!grids[@]}"; do
      g=${grids[$k]}
      say "solver against CHOLMOD: grid $g x $g (writing the matrix)"
      # also the warm-up, and the one-pass process whose max RSS is compared (a second pass would add the first's garbage)
      /usr/bin/time -v -o "$work/sn/write-$g.time" "${B[@]}" supernodal "$g" "$g" "$work/mtx" "$threads" 1 >"$work/sn/write-$g.out"
      one_pass_rss=$(sed -n 's/.*Maximum resident set size (kbytes): //p' "$work/sn/write-$g.time")
      A=$work/mtx/wall${g}x${g}.mtx; b=$work/mtx/wall${g}x${g}_b.mtx
      n=$(M field "$work/sn/write-$g.out" n)
      ratios=(); mems=()
      declare -A ctot=()
      for ((r = 1; r <= ${rounds[$k]}; r++)); do
        say "  round $r of ${rounds[$k]}"
        /usr/bin/time -v -o "$work/sn/ours-$g-$r.time" "${B[@]}" supernodal "$g" "$g" - "$threads" "$repeat" >"$work/sn/ours-$g-$r.out"
        ours=$(M phases "$work/sn/ours-$g-$r.out" t_order t_symbolic t_factor t_solve)
        ours_rss=$(sed -n 's/.*Maximum resident set size (kbytes): //p' "$work/sn/ours-$g-$r.time")
        best=""; best_rss=""; best_ord=""
        for o in "${orderings[@]}"; do
          if OPENBLAS_NUM_THREADS=$threads OMP_NUM_THREADS=$threads /usr/bin/time -v -o "$work/sn/ch-$o-$g-$r.time" \
               "$C" "$A" "$b" --ordering "$o" --repeat "$repeat" >"$work/sn/ch-$o-$g-$r.out" 2>&1; then
            t=$(M phases "$work/sn/ch-$o-$g-$r.out" t_analyze t_factor t_solve)
            ctot[$o]="${ctot[$o]:-} $t"
            if [[ -z $best ]] || [[ $(M met "$t" le "$best") == yes ]]; then
              best=$t; best_ord=$o; best_rss=$(sed -n 's/.*Maximum resident set size (kbytes): //p' "$work/sn/ch-$o-$g-$r.time")
            fi
          else
            notes+=("CHOLMOD with --ordering $o failed at grid $g (round $r)")
          fi
        done
        [[ -n $best ]] || continue
        ratios+=("$(M div "$ours" "$best")")
        mems+=("$(M div "$one_pass_rss" "$best_rss")")
        details+=("- n = $n, round $r: ours $ours s (max RSS $((ours_rss / 1024)) MiB), CHOLMOD's fastest $best_ord $best s (max RSS $((best_rss / 1024)) MiB)")
      done
      if [[ ${#ratios[@]} -gt 0 ]]; then
        label="Solver: order + analyse + factorise + solve ÷ CHOLMOD's fastest ordering, n = $n (grid $g)"
        row "$label" "$(M stats "${ratios[@]}")" le "${targets[$k]}"
        for o in "${!ctot[@]}"; do
          # shellcheck disable=SC2086
          details+=("- n = $n, CHOLMOD $o: total $(M stats ${ctot[$o]} | cut -d' ' -f1) s (median of the rounds)")
        done
        if [[ $k == $(( ${#grids[@]} - 1 )) ]]; then
          row "Solver: peak memory (max RSS of a one-pass process) ÷ CHOLMOD's, fastest ordering, n = $n" "$(M stats "${mems[@]}")" le 1.1
        fi
      fi
      unset ctot
      rm -f "$A" "$b"
    done
    chver=$(head -1 "$work/sn/ch-amd-${grids[0]}-1.out" 2>/dev/null | sed 's/, matrix .*//' || true)
  fi
fi

# ---- 3. The default sweep on 2 processors against 1 -----------------------------------------------------------------
if [[ $skip_sweep == 0 ]]; then
  if [[ $procs -lt 2 ]]; then
    notes+=("Default sweep skipped: one processor")
  else
    sweep_builds=("ReadyToRun:$P")
    [[ -n $native ]] && sweep_builds+=("Native AOT:$native")
    say "default sweep: 2 processors against 1 ($(printf '%s, ' "${sweep_builds[@]%%:*}" | sed 's/, $//'))"
    mkdir -p "$work/sw"
    # one warm-up pair per build, then $sweep_pairs pairs, the builds interleaved; every run's files compared with the first's
    for ((i = 0; i <= sweep_pairs; i++)); do
      [[ $i == 0 ]] && sfx=warm || sfx=log
      for b in "${sweep_builds[@]}"; do
        name=${b%%:*}; exe=${b#*:}; tag=${name// /}
        for c in two one; do
          [[ $c == two ]] && cpus=0,1 || cpus=0
          rm -rf "$work/sweep-$tag-$c"
          M run "$work/sw/$c-$tag.$sfx" taskset -c $cpus "$exe" sweep --out "$work/sweep-$tag-$c"
          [[ -d $work/sweep-ref ]] || cp -r "$work/sweep-$tag-$c" "$work/sweep-ref"
          diff -r -q "$work/sweep-ref" "$work/sweep-$tag-$c" >/dev/null || sweep_differs="$name on ${cpus//,/ and } processor(s)"
        done
      done
    done
    for b in "${sweep_builds[@]}"; do
      name=${b%%:*}; tag=${name// /}
      row "Default sweep (\`planelateral sweep\`, whole process), $name: wall time on 1 processor ÷ on 2" "$(M ratio "$work/sw/one-$tag.log" "$work/sw/two-$tag.log" wall)" ge 1.8
      details+=("- default sweep, $name: 2 processors median wall $(M median "$work/sw/two-$tag.log" wall) s (CPU $(M median "$work/sw/two-$tag.log" cpu) s), 1 processor $(M median "$work/sw/one-$tag.log" wall) s (CPU $(M median "$work/sw/one-$tag.log" cpu) s)")
    done
    if [[ -n ${sweep_differs:-} ]]; then notes+=("Default sweep: the files of a run ($sweep_differs) differ from the first run's")
    else details+=("- default sweep: every run's three files byte-identical (\`diff -r\`), both builds, 1 and 2 processors"); fi
  fi
fi

# ---- The report -----------------------------------------------------------------------------------------------------
load_after=$(cut -d' ' -f1-3 /proc/loadavg)
elapsed=$(( $(date +%s) - t_start ))
commit=$(git rev-parse --short HEAD 2>/dev/null || echo unknown)
[[ -n $(git status --porcelain --untracked-files=no 2>/dev/null) ]] && commit="$commit (with uncommitted changes)"
cpu=$(sed -n 's/^model name[[:space:]]*: //p' /proc/cpuinfo | head -1)
report=$(
  echo "### Issue 19's ratios$([[ $quick == 1 ]] && echo ' (--quick: small sizes, few runs; for testing the script, not for judging)')"
  echo
  echo "| target | measured: median (min–max) | pairs or rounds | target | met (median) |"
  echo "|---|---:|---:|---:|---|"
  printf '%s\n' "${rows[@]}"
  echo
  echo "Machine: ${cpu:-unknown CPU}, $procs processors, $(awk '/MemTotal/ {printf "%.0f GiB", $2/1048576}' /proc/meminfo); load average (1, 5, 15 min) before $load_before, after $load_after."
  echo "Date: $date_start; commit $commit; .NET SDK $(dotnet --version); run took $((elapsed / 60)) min $((elapsed % 60)) s."
  [[ -n ${chver:-} ]] && echo "Reference: ${chver}, BLAS ${blas:-unknown}, $threads threads for both solvers (OPENBLAS_NUM_THREADS, OMP_NUM_THREADS; ours THREADS)."
  echo
  echo "Medians behind the ratios:"
  echo
  printf '%s\n' "${details[@]}"
  if [[ ${#notes[@]} -gt 0 ]]; then echo; echo "Notes:"; echo; printf -- '- %s\n' "${notes[@]}"; fi
)
echo "$report"
if [[ -n $out ]]; then echo "$report" >"$out"; say "written to $out"; fi
[[ $keep == 1 ]] && say "raw logs kept in $work"
exit 0
