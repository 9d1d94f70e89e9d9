#!/usr/bin/env python3
"""Wall-panel models at the edge of ModelLimits' panel limits (invented data, for timing only; docs/hardening.md,
"Size limits").

  python3 benchmarks/edge/make_panels.py DIR [PANELS] [CASES] [REFINEMENTS]

writes DIR/panels-edge.json: PANELS solid concrete walls of 9.9 m x 9.9 m, 0.3 m thick, three floors, meshed with
9-node elements of 0.1 m (99 x 99 elements, 39 601 nodes: the largest mesh under mesh.maxNodes = 40 000), under CASES
load cases, each a different set of story forces. With REFINEMENTS > 1 the finest mesh of the convergence study is the
one of 39 601 nodes (the base mesh's elements are 2^(REFINEMENTS-1) times larger).
"""
import json
import os
import sys


def panel(i, cases, refinements):
    size = 0.1 * 2 ** (refinements - 1)
    return {"id": "wall %d" % (i + 1), "x": 12.0 * i, "y": 0, "length": 9.9, "height": 9.9, "thickness": 0.3,
            "material": "concrete", "floorLevels": [3.3, 6.6],
            "mesh": {"element": "quad9", "elementSize": size, "maxNodes": 40000, "refinements": refinements},
            "storyForces": [f for c in range(cases) for f in (
                {"case": "case %d" % (c + 1), "level": 3.3, "fx": 10 + c},
                {"case": "case %d" % (c + 1), "level": 6.6, "fx": 20 + c},
                {"case": "case %d" % (c + 1), "level": "top", "fx": 30 + c, "fy": -100})]}


def main(out, panels, cases, refinements):
    os.makedirs(out, exist_ok=True)
    model = {"formatVersion": 1, "title": "edge-of-limit wall panels (invented)", "units": {"force": "kN", "length": "m"},
             "materials": [{"id": "concrete", "E": 25000000, "nu": 0.2}], "sections": [],
             "loadCases": [{"id": "case %d" % (c + 1)} for c in range(cases)],
             "panels": [panel(i, cases, refinements) for i in range(panels)]}
    with open(os.path.join(out, "panels-edge.json"), "w") as f:
        json.dump(model, f, separators=(",", ":"))


if __name__ == "__main__":
    a = sys.argv[1:]
    main(a[0] if a else "/tmp/panel-edge", int(a[1]) if len(a) > 1 else 1, int(a[2]) if len(a) > 2 else 1,
         int(a[3]) if len(a) > 3 else 1)
