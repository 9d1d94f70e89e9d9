#!/usr/bin/env python3
"""Buildings in plan at the edge of ModelLimits (invented data, for timing only; docs/hardening.md, "Size limits").

  frames-edge.json  19 three-bay steel frame lines of 300 stories of 10 ft (3,304 nodes and members each), two load cases:
                    19 x 3,304 x (300 floors + 6 cases) = 19.2 million line result entries, under the 20 million limit
  walls-edge.json   4 compact concrete walls, 300 floors, a seismic block with the response spectrum (modes: 90 % of
                    the mass): the floor limit with the dense modal step at its largest (900 floor DOFs)
"""
import json
import os
import sys


def frame(stories, bays):
    nodes = [{"id": "C%d-L%d" % (c, l), "x": 30 * c, "y": 10 * l} for l in range(stories + 1) for c in range(bays + 1)]
    members = []
    for l in range(1, stories + 1):
        for c in range(bays + 1):
            members.append({"id": "COL%d-S%d" % (c, l), "start": "C%d-L%d" % (c, l - 1), "end": "C%d-L%d" % (c, l), "section": "COL", "material": "ST"})
        for c in range(bays):
            members.append({"id": "BM%d-L%d" % (c, l), "start": "C%d-L%d" % (c, l), "end": "C%d-L%d" % (c + 1, l), "section": "BM", "material": "ST"})
    return {"formatVersion": 1, "units": {"force": "kip", "length": "ft"}, "materials": [{"id": "ST", "E": 4176000, "nu": 0.3}],
            "sections": [{"id": "COL", "shape": "general", "A": 0.5, "I": 0.5}, {"id": "BM", "shape": "general", "A": 0.2, "I": 0.2}],
            "nodes": nodes, "members": members, "supports": [{"node": "C%d-L0" % c, "type": "fixed"} for c in range(bays + 1)],
            "levels": [{"id": "base", "elevation": 0, "diaphragm": "none"}] + [{"id": "L%d" % l, "elevation": 10 * l} for l in range(1, stories + 1)]}


def building(lines, stories, seismic):
    p = {"outline": [[0, 0], [200, 0], [200, 120], [0, 120]], "accidentalEccentricity": 0.05,
         "levels": [{"id": "base", "elevation": 0}] + [{"id": "L%d" % l, "elevation": 10 * l, "weight": 500} for l in range(1, stories + 1)],
         "lines": lines,
         "loads": [{"id": "EX", "direction": "x", "forces": [10] * stories}, {"id": "EY", "direction": "y", "forces": [10] * stories}]}
    if seismic:
        p["seismic"] = {"loadCase": "E", "structureType": "other", "spectrum": {"SDS": 0.8, "SD1": 0.42, "R": 5, "Ie": 1, "TL": 8},
                        "responseSpectrum": {"combination": "CQC", "damping": 0.05, "Cd": 5}}
    return {"formatVersion": 1, "title": "edge-of-limit building (invented)", "units": {"force": "kip", "length": "ft"},
            "materials": [{"id": "C", "E": 580464, "nu": 0.2}], "plan": p}


def main(out):
    os.makedirs(out, exist_ok=True)
    frames = [{"id": "F%d" % i, "direction": "x" if i % 2 == 0 else "y",
               "at": [5 + 2 * i, 10 + i] if i % 2 == 0 else [10 + 3 * i, 5 + i], "model": frame(300, 3)} for i in range(19)]
    walls = [{"id": "W%d" % i, "at": at, "direction": d, "wall": {"length": 60, "thickness": 1, "material": "C"}}
             for i, (at, d) in enumerate([([1, 60], "y"), ([199, 60], "y"), ([100, 1], "x"), ([100, 119], "x")])]
    for name, b in (("frames-edge.json", building(frames, 300, False)), ("walls-edge.json", building(walls, 300, True))):
        with open(os.path.join(out, name), "w") as f:
            json.dump(b, f, separators=(",", ":"))


if __name__ == "__main__":
    main(sys.argv[1] if len(sys.argv) > 1 else "/tmp/plan-edge")
