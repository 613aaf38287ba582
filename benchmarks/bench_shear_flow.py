"""Benchmark: shear flow and flange-to-web weld zoning along a 3-span welded girder at 2001 stations.

Goal (brief): <= 20 ms for shear flow plus weld zoning (numeric path, steps=False).
Run: .venv/bin/python benchmarks/bench_shear_flow.py
"""
import time

import numpy as np

import calckit
from calckit.analysis.combinations import combinations
from calckit.design.shear_flow import as_envelope, design_flange_welds, shear_flow

GOAL_MS = 20.0
REPEAT = 50


def timed(fn, repeat=REPEAT):
    ts = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        ts.append(time.perf_counter() - t)
    return min(ts) * 1e3, float(np.median(ts)) * 1e3


def main():
    beam = calckit.Beam(["20 m", "25 m", "20 m"], ["pin", "roller", "roller", "pin"], EI="4e6 kN*m**2")
    beam.udl("20 kN/m", "D").udl("30 kN/m", "L")
    env = beam.solve().envelope(combinations("ASCE 7-22", {"D", "L"}), n_per_span=666)
    print(f"stations: {env.x.size} (analysis envelope, 3 spans 20 + 25 + 20 m)")
    g = calckit.PlateGirder(d="1600 mm", tw="12 mm", bf_top="450 mm", tf_top="30 mm", bf_bot="400 mm",
                            tf_bot="25 mm", name="G1")
    t = time.perf_counter()
    design_flange_welds(g, env, steel="A572-50", intermittent=True, steps=False)
    print(f"first call (compiles the formulas with sympy once per process): {(time.perf_counter() - t) * 1e3:.0f} ms")
    se = as_envelope(env)
    cases = [
        ("shear flow only (q = VQ/I at both junctions)", lambda: shear_flow(g, se)),
        ("AISC LRFD continuous welds", lambda: design_flange_welds(g, env, steel="A572-50", steps=False)),
        ("AISC LRFD intermittent welds by zones", lambda: design_flange_welds(g, env, steel="A572-50",
                                                                              intermittent=True, steps=False)),
        ("EN 1993-1-8 intermittent welds by zones",
         lambda: design_flange_welds(g, env, steel="S355", standard="EN", intermittent=True, steps=False)),
        ("AISC intermittent + flange load", lambda: design_flange_welds(
            g, env, steel="A572-50", intermittent=True, steps=False, flange_loads=[(30.0, 300e3, 0.2, "top")])),
        ("AISC intermittent, calc-sheet steps on", lambda: design_flange_welds(g, env, steel="A572-50",
                                                                               intermittent=True, steps=True)),
    ]
    worst = 0.0
    for name, fn in cases:
        lo, med = timed(fn)
        if "steps on" not in name:
            worst = max(worst, med)
        print(f"{name:48s} min {lo:7.2f} ms   median {med:7.2f} ms")
    print(f"numeric path worst median {worst:.2f} ms; goal <= {GOAL_MS:.0f} ms: {'met' if worst <= GOAL_MS else 'NOT met'}")


if __name__ == "__main__":
    main()
