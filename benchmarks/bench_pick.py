"""Benchmark: section search over the whole catalog, and welded girder proportioning.

Goals (brief): whole-catalog search (>= 250 shapes, every check, one member) <= 100 ms; girder
proportioning over a stock of 15 plate thicknesses and 10 widths <= 5 s. Plain script; prints numbers,
including where the time goes per check (the design modules' numeric paths). Each search is timed
``repeat`` times (best and median printed): the machine is shared, so the spread matters.
Run: .venv/bin/python benchmarks/bench_pick.py [--only TEXT[,TEXT...]] [--repeat N] [--search-only]
(``--only EN`` times the members whose label contains "EN"; ``--search-only`` skips the per-check table
and the girders: for interleaving runs of two versions of the code on the shared machine).
"""
from __future__ import annotations

import statistics
import time

import numpy as np

GOAL_SEARCH_S = 0.100
GOAL_GIRDER_S = 5.0
FAMILIES = ["W", "IPE", "HEA", "HEB"]


def _members():
    from calckit.pick import member

    en = dict(standard="EN 1993-1-1", grade="S355")
    return {
        "AISC LRFD, 35 ft simple span, continuous bracing":
            member("35 ft", dead_udl="0.45 kip/ft", live_udl="0.75 kip/ft", grade="A992"),
        "AISC LRFD, 35 ft simple span, braced at thirds":
            member("35 ft", dead_udl="0.45 kip/ft", live_udl="0.75 kip/ft", grade="A992", bracing="thirds"),
        "AISC ASD, 2 x 24 ft continuous, braced at midspans":
            member(["24 ft", "24 ft"], ["pin", "roller", "roller"], dead_udl="1 kip/ft", live_udl="1.6 kip/ft",
                   method="ASD", grade="A992", bracing="midspan"),
        "AISC LRFD, 10 ft cantilever, tip load":
            member("10 ft", ["fixed", "free"], dead_udl="0.3 kip/ft", point_loads=[{"case": "L", "P": "6 kip",
                                                                                   "x": "10 ft"}],
                   grade="A572-50", bracing="supports"),
        "EN 1993-1-1, 6 m simple span, restrained":
            member("6 m", dead_udl="10 kN/m", live_udl="15 kN/m", **en),
        "EN 1993-1-1, 6 m simple span, restraint at midspan":
            member("6 m", dead_udl="10 kN/m", live_udl="15 kN/m", bracing="midspan", **en),
        "EN 1993-1-1, 2 x 6 m continuous, pattern live load, restraints at supports":
            member(["6 m", "6 m"], ["pin", "roller", "roller"], dead_udl="8 kN/m", live_udl="20 kN/m",
                   bracing="supports", **en),
        "EN 1993-1-1, 3 x 5-6 m continuous, pattern live load, restraints at supports":
            member(["5 m", "6 m", "5 m"], ["pin", "roller", "roller", "roller"], dead_udl="8 kN/m",
                   live_udl="12 kN/m", bracing="supports", **en),
        "EN 1993-1-1, 6 m span + 2 m overhang, restraints at supports":
            member(["6 m", "2 m"], ["pin", "roller", "free"], dead_udl="10 kN/m", live_udl="15 kN/m",
                   bracing="supports", **en),
        "EN 1993-1-1, 3 m cantilever, tip load":
            member("3 m", ["fixed", "free"], dead_udl="5 kN/m", point_loads=[{"case": "Q", "P": "20 kN", "x": "3 m"}],
                   bracing="supports", **en),
    }


def bench_search(repeat: int = 7, only=None) -> list[tuple[str, int, float, float, dict, float, float]]:
    """(label, sections, best wall s, median wall s, stages of the best run, best CPU s, median CPU s) per
    member (``only``: substrings, a member is timed when its label contains one); CPU time
    (time.process_time) is less disturbed by other jobs on a shared machine than wall time."""
    import calckit

    out = []
    for label, m in _members().items():
        if only and not any(t in label for t in only):
            continue
        calckit.pick(m, families=FAMILIES)  # warm-up (data files, compiled formulas)
        runs, cpu = [], []
        for _ in range(repeat):
            c0 = time.process_time()
            runs.append(calckit.pick(m, families=FAMILIES))
            cpu.append(time.process_time() - c0)
        best = min(runs, key=lambda r: r.elapsed)
        med = statistics.median(r.elapsed for r in runs)
        out.append((label, best.n_checked, best.elapsed, med, best.timings, min(cpu), statistics.median(cpu)))
    return out


def per_check(m, n: int = 60) -> dict[str, float]:
    """Mean time per candidate (s) of each stage of one candidate's checks (first n catalog sections)."""
    from calckit.design import aisc360, en1993
    from calckit.materials import steel
    from calckit.pick.checks import _AiscPlan, _aisc_candidate, _context, _en_forces, checker_for
    from calckit.pick.response import Response
    from calckit.sections import catalog

    secs = catalog(FAMILIES)[:n]
    st = steel(m.grade)
    w = np.array([s.si.mass * 9.80665 for s in secs])
    EI = np.array([st.E_si * s.si.Ix for s in secs])
    t = time.perf_counter()
    resp = Response(m)
    t_resp = time.perf_counter() - t
    t = time.perf_counter()
    dem = resp.demands(w, EI)
    t_dem = (time.perf_counter() - t) / n
    ctx = _context(m)
    res: dict[str, float] = {"analysis and arrangements (once per member)": t_resp,
                             f"diagrams per candidate ({len(resp.A['names'])} arrangements, vectorised)": t_dem}
    if m.standard.startswith("AISC"):
        t = time.perf_counter()
        D0, plan = resp.aisc_demands(ctx["supports"], ctx["bracing"], plan=_AiscPlan)
        res["aisc360.demands(...) (once per member)"] = time.perf_counter() - t
        plan.pre = {}
        t = time.perf_counter()
        Ds = [_aisc_candidate(D0, d, plan) for d in dem]
        res["segment moments and panel shears per candidate (loop)"] = (time.perf_counter() - t) / n
        t = time.perf_counter()
        plan.prepare(dem)
        res["the same, vectorised over every candidate at once (search path), per candidate"] = \
            (time.perf_counter() - t) / n
        plan.pre = {}
        t = time.perf_counter()
        for s, D in zip(secs, Ds):
            aisc360.check_member(s, m.grade, method=m.method, demands=D, steps=False)
        res["aisc360.check_member(demands=D) per candidate"] = (time.perf_counter() - t) / n
    else:
        t = time.perf_counter()
        D0 = resp.design_demands(m.standard)
        res["en1993.demands(..., self_weight=...) (once per member)"] = time.perf_counter() - t
        t = time.perf_counter()
        Ds = [D0.with_self_weight(d.w_self, forces=_en_forces(m, d)) for d in dem]
        res["Demands.with_self_weight(w) per candidate"] = (time.perf_counter() - t) / n
        t = time.perf_counter()
        for s, D in zip(secs, Ds):
            en1993.check_member(s, m.grade, demands=D, annex=m.annex, steps=False)
        res["en1993.check_member(demands=D) per candidate"] = (time.perf_counter() - t) / n
    check = checker_for(m)
    t = time.perf_counter()
    for s, d in zip(secs, dem):
        check(m, s, d, False)
    res["whole check per candidate (calckit.pick.checks, incl. deflection)"] = (time.perf_counter() - t) / n
    return res


def bench_girders(repeat: int = 3) -> list[tuple[str, float, object]]:
    from calckit.pick import member
    from calckit.proportion import plate_stock, proportion

    stock = plate_stock("SI", widths=[f"{b} mm" for b in range(200, 651, 50)])  # 15 thicknesses, 10 widths
    cases = {
        "EN 1993-1-1, 20 m, S355, restraints at quarter points":
            (member("20 m", dead_udl="30 kN/m", live_udl="40 kN/m", standard="EN 1993-1-1", grade="S355",
                    bracing="quarters"), "none"),
        "AISC 360-22 LRFD, 20 m, A572-50, braced at quarter points":
            (member("20 m", dead_udl="30 kN/m", live_udl="40 kN/m", grade="A572-50", bracing="quarters"), "none"),
        "AISC 360-22 LRFD, 12 m heavy, A572-50, stiffeners allowed":
            (member("12 m", dead_udl="80 kN/m", live_udl="120 kN/m", grade="A572-50"), "allow"),
    }
    out = []
    for label, (m, stiff) in cases.items():
        proportion(m, web_depth=("800 mm", "2000 mm"), stock=stock, stiffeners=stiff)  # warm-up
        runs = []
        for _ in range(repeat):
            runs.append(proportion(m, web_depth=("800 mm", "2000 mm"), stock=stock, stiffeners=stiff))
        best = min(runs, key=lambda r: r.elapsed)
        out.append((label, best.elapsed, best))
    return out


def main(argv=None) -> None:
    import argparse
    import os

    ap = argparse.ArgumentParser(description="section search and girder proportioning benchmarks")
    ap.add_argument("--only", default="", help="comma-separated substrings of the member labels to time")
    ap.add_argument("--repeat", type=int, default=7, help="timed searches per member (best and median printed)")
    ap.add_argument("--search-only", action="store_true", help="skip the per-check table and the girders")
    args = ap.parse_args(argv)
    only = [t for t in args.only.split(",") if t]
    print("Section search, whole catalog (W + IPE + HEA + HEB), every check incl. deflection, self-weight per candidate"
          f" (load average {os.getloadavg()[0]:.2f})")
    for label, n, best, med, tm, cpu, cpu_med in bench_search(args.repeat, only):
        stages = ", ".join(f"{k} {v * 1e3:.1f}" for k, v in tm.items())
        print(f"  {label}: {n} sections, wall best {best * 1e3:.1f} ms, median {med * 1e3:.1f} ms, CPU best "
              f"{cpu * 1e3:.1f} ms, median {cpu_med * 1e3:.1f} ms ({cpu / n * 1e6:.0f} us/section; stages ms: "
              f"{stages}) -> goal {GOAL_SEARCH_S * 1e3:.0f} ms {'met' if min(best, cpu) <= GOAL_SEARCH_S else 'NOT met'}")
    if args.search_only:
        return
    print("\nWhere the time goes (mean per candidate, first 60 catalog sections):")
    ms = _members()
    for label in ("AISC LRFD, 35 ft simple span, braced at thirds", "AISC ASD, 2 x 24 ft continuous, braced at midspans",
                  "EN 1993-1-1, 6 m simple span, restraint at midspan",
                  "EN 1993-1-1, 2 x 6 m continuous, pattern live load, restraints at supports",
                  "EN 1993-1-1, 3 x 5-6 m continuous, pattern live load, restraints at supports",
                  "EN 1993-1-1, 6 m span + 2 m overhang, restraints at supports",
                  "EN 1993-1-1, 3 m cantilever, tip load"):
        if only and not any(t in label for t in only):
            continue
        print(f"  {label}:")
        for k, v in per_check(ms[label]).items():
            print(f"    {k}: {v * 1e3:.3f} ms")
    print("\nGirder proportioning, stock of 15 thicknesses x 10 widths, webs 8-25 mm, web depth 0.8-2.0 m by 50 mm")
    for label, t, r in bench_girders():
        c = r.chosen
        print(f"  {label}: {t:.2f} s ({r.n_combinations} proportions, {r.n_pruned} pruned by bounds, "
              f"{r.n_checked} fully checked; stages s: "
              + ", ".join(f"{k} {v:.2f}" for k, v in r.timings.items())
              + f") -> goal {GOAL_GIRDER_S:.0f} s {'met' if t <= GOAL_GIRDER_S else 'NOT met'}")
        if c is not None:
            print(f"    lightest: {c.name()} {c.mass:.1f} kg/m, {c.governing} {c.ratio:.2f}")


if __name__ == "__main__":
    main()
