#!/usr/bin/env python3
"""Timing and arithmetic for benchmarks/ratios/run.sh (Python standard library only).

  measure.py run LOG CMD [ARG...]     run CMD (its output to /dev/null), append "wall cpu maxrss_kib exit" to LOG;
                                      wall from time.perf_counter, cpu = user + system of CMD and its children (wait4)
  measure.py ratio NUM DEN FIELD      per-line ratios NUM/DEN of FIELD (wall or cpu) of two LOGs written in turn:
                                      prints "median min max count"
  measure.py median LOG FIELD         the median of FIELD in LOG
  measure.py phases OUT KEY...        the minimum of each KEY=value over the RESULT lines of a program's output, summed
  measure.py field OUT KEY            KEY's value on the last RESULT line of OUT
  measure.py stats V...               "median min max count" of the values
  measure.py met VALUE OP TARGET      "yes" or "no" (OP is le or ge)
  measure.py div A B                  A / B
"""
import os
import statistics
import subprocess
import sys
import time

FIELDS = {"wall": 0, "cpu": 1, "maxrss": 2}


def run(log, cmd):
    t0 = time.perf_counter()
    with open(os.devnull, "wb") as null:
        p = subprocess.Popen(cmd, stdout=null, stderr=null)
        _, status, usage = os.wait4(p.pid, 0)
    wall = time.perf_counter() - t0
    code = os.waitstatus_to_exitcode(status)
    with open(log, "a") as f:
        f.write(f"{wall:.6f} {usage.ru_utime + usage.ru_stime:.6f} {usage.ru_maxrss} {code}\n")
    return code


def column(log, field):
    with open(log) as f:
        return [float(line.split()[FIELDS[field]]) for line in f if line.strip()]


def stats(values):
    return f"{statistics.median(values):.3f} {min(values):.3f} {max(values):.3f} {len(values)}"


def results(out):
    rows = []
    with open(out) as f:
        for line in f:
            if line.startswith("RESULT "):
                rows.append(dict(kv.split("=", 1) for kv in line.split()[1:] if "=" in kv))
    if not rows:
        sys.exit(f"{out}: no RESULT line")
    return rows


def main(argv):
    cmd = argv[1]
    if cmd == "run":
        return 0 if run(argv[2], argv[3:]) == 0 else 1
    if cmd == "ratio":
        num, den = column(argv[2], argv[4]), column(argv[3], argv[4])
        print(stats([a / b for a, b in zip(num, den)]))
    elif cmd == "median":
        print(f"{statistics.median(column(argv[2], argv[3])):.3f}")
    elif cmd == "phases":
        rows = results(argv[2])
        print(f"{sum(min(float(r[k]) for r in rows) for k in argv[3:]):.4f}")
    elif cmd == "field":
        print(results(argv[2])[-1][argv[3]])
    elif cmd == "stats":
        print(stats([float(v) for v in argv[2:]]))
    elif cmd == "met":
        value, op, target = float(argv[2]), argv[3], float(argv[4])
        print("yes" if (value <= target if op == "le" else value >= target) else "no")
    elif cmd == "div":
        print(f"{float(argv[2]) / float(argv[3]):.4f}")
    else:
        sys.exit(__doc__)
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
