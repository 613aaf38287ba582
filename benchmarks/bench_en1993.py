"""Speed of calckit.design.en1993 (plain script: prints measured numbers; not a test).

Goals (brief): one full member check with steps <= 20 ms; numeric path <= 0.3 ms per section.
Each figure is the median (and the best) of ``REPEAT`` timed runs, so that a loaded machine shows in the
spread rather than in one number.
Run: .venv/bin/python benchmarks/bench_en1993.py
"""
from __future__ import annotations

import statistics
import time

import numpy as np

import calckit
from calckit.design import en1993
from calckit.design.en1993._common import material
from calckit.design.en1993.bending import bending_si
from calckit.design.en1993.classify import classify_si
from calckit.design.en1993.factors import annex_set
from calckit.design.en1993.ltb import ltb_si
from calckit.design.en1993.shear import shear_si

REPEAT = 15


def timed(fn, n, repeat=REPEAT):
    """(median, best) seconds per call of ``fn`` over ``repeat`` runs of ``n`` calls."""
    fn()
    out = []
    for _ in range(repeat):
        t = time.perf_counter()
        for _ in range(n):
            fn()
        out.append((time.perf_counter() - t) / n)
    return statistics.median(out), min(out)


def line(text, t, per=1, goal=""):
    med, best = t
    print(f"{text:<78s} median {med / per * 1e3:7.3f} ms, best {best / per * 1e3:7.3f} ms{goal}")


def main() -> None:
    L, w = 5.7, 22.28e3
    x = np.linspace(0.0, L, 101)
    M, V = w * x * (L - x) / 2, w * (L / 2 - x)
    ipe = calckit.section("IPE 330")
    forces = [{"x": 0.0, "ss": 0.1, "F": w * L / 2, "load_type": "c", "c": 0.0, "flange": "bottom"}]
    defl = {"SLS characteristic": ("total", 0.015)}

    def full():
        return en1993.check_member(ipe, "S235", x=x, M=M, V=V, zg=0.165, method="rolled", forces=forces,
                                   deflections=defl, steps=True)

    t0 = time.perf_counter()
    full()
    cold = time.perf_counter() - t0
    print(f"full member check with steps, first call (formulas compiled by sympy): {cold * 1e3:8.1f} ms")
    line("full member check with steps, warm", timed(full, 10), goal="   (goal <= 20 ms)")

    sections = [calckit.section(n) for n in ("IPE 200", "IPE 240", "IPE 300", "IPE 330", "IPE 400", "IPE 450",
                                             "IPE 500", "HEA 200", "HEA 300", "HEB 300")]
    n = len(sections)

    def numeric_member():
        for s in sections:
            en1993.check_member(s, "S355", x=x, M=M, V=V, zg=0.165, method="rolled", steps=False)

    def numeric_member_zg0():
        for s in sections:
            en1993.check_member(s, "S355", x=x, M=M, V=V, method="rolled", steps=False)

    line("numeric check_member, arrays in (C1/C2 by energy solution, z_g != 0), per section",
         timed(numeric_member, 10), n, "   (goal <= 0.3 ms)")
    line("numeric check_member, arrays in (z_g = 0, C1 only), per section", timed(numeric_member_zg0, 10), n)
    if hasattr(en1993, "demands"):
        D = en1993.demands(x=x, M=M, V=V, zg=0.165)
        D0 = en1993.demands(x=x, M=M, V=V)

        def with_demands():
            for s in sections:
                en1993.check_member(s, "S355", demands=D, method="rolled", steps=False)

        def with_demands_zg0():
            for s in sections:
                en1993.check_member(s, "S355", demands=D0, method="rolled", steps=False)

        line("numeric check_member, demands= prepared once (z_g != 0), per section", timed(with_demands, 10), n,
             "   (goal <= 0.3 ms)")
        line("numeric check_member, demands= prepared once (z_g = 0), per section", timed(with_demands_zg0, 10), n)
        line("en1993.demands(...) itself, per member", timed(lambda: en1993.demands(x=x, M=M, V=V, zg=0.165), 20))

        # an overhang: 6 m back span + 2 m overhang, UDL, restraints at the supports only
        Lb, Lo = 6.0, 2.0
        xo = np.linspace(0.0, Lb + Lo, 161)
        RA = (w * Lb ** 2 / 2 - w * Lo ** 2 / 2) / Lb
        Mo = np.where(xo <= Lb, RA * xo - w * xo ** 2 / 2, -w * (Lb + Lo - xo) ** 2 / 2)
        Vo = np.where(xo <= Lb, RA - w * xo, w * (Lb + Lo - xo))
        Do = en1993.demands(x=xo, M=Mo, V=Vo, restraints=[0.0, Lb], zg=0.165)

        def overhang():
            for s in sections:
                en1993.check_member(s, "S355", demands=Do, method="rolled", steps=False)

        line("numeric check_member with a 2 m overhang (energy model of overhang + back span), per section",
             timed(overhang, 3, 7), n)

        # the real diagram of every load arrangement (calckit.analysis.arrangements): 2 x 6 m, G + Q patterned
        from calckit.analysis import Beam, arrangements
        from calckit.analysis.combinations import combinations

        b = Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
        b.udl("8 kN/m", "G").udl("20 kN/m", "Q").udl("1 N/m", "SW")
        sol = b.solve()
        combos = combinations("EN 1990", ["G", "Q"], "strength", category="B")
        arr = arrangements(sol, combos)
        env = sol.envelope(combos)
        for rs, what in (([0, 6, 12], "restraints at supports"), ([0, 3, 6, 9, 12], "restraints at supports and midspans")):
            Da = en1993.demands(analysis=arr, restraints=rs)
            De = en1993.demands(analysis=env, restraints=rs)
            nseg = len(rs) - 1

            def per_diagram(D=Da):
                for s in sections:
                    en1993.check_member(s, "S355", demands=D, steps=False)

            def envelope_path(D=De):
                for s in sections:
                    en1993.check_member(s, "S355", demands=D, steps=False)

            line(f"2 x 6 m, {len(arr)} diagrams, {nseg} segments ({what}): demands= per diagram, per section",
                 timed(per_diagram, 3, 7), n)
            line("  same member, envelope input (C1 from an envelope curve, approximate), per section",
                 timed(envelope_path, 3, 7), n)
        line(f"  en1993.demands(analysis=<{len(arr)} BeamResults>) itself, per member",
             timed(lambda: en1993.demands(analysis=arr, restraints=[0, 6, 12]), 5, 7))
        # the section search's path: loads-only diagrams + unit self-weight, with_self_weight(w) per candidate
        f = {nm: (1.35 if "1.35G" in nm else 1.0) for nm in arr}
        x_, M_, V_, _, _ = en1993.from_analysis(arr)
        _, MU, VU, _, _ = en1993.from_analysis(sol["SW"])
        Dsw = en1993.demands(x=x_, M=M_, V=V_, self_weight=(MU, VU, f), restraints=[0, 6, 12])
        masses = [s.si.mass * 9.80665 for s in sections]

        def search_path():
            for s, w_ in zip(sections, masses):
                en1993.check_member(s, "S355", demands=Dsw.with_self_weight(w_), steps=False)

        line(f"  section search path: with_self_weight(w) + check_member, {len(arr)} diagrams, per section",
             timed(search_path, 3, 7), n)

    ann = annex_set("recommended")
    props = [(s.si, material(s.si, "S355")) for s in sections]

    def numeric_core():
        for si, mat in props:
            cl = classify_si(si, mat)
            sh = shear_si(si, mat, ann)
            bending_si(si, mat, ann, cl=cl, sh=sh, V_Ed=60e3)
            ltb_si(si, mat, ann, L=L, C1=1.127, C2=0.454, zg=0.165, method="rolled", cl=cl)

    line("numeric section core (classify + shear + bending with V + LTB, C1 given), per section",
         timed(numeric_core, 20), n)


if __name__ == "__main__":
    main()
