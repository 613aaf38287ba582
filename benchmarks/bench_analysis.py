"""Beam analysis speed goals (issue 3):

1. 5 spans, 20 mixed loads: solve and evaluate V, M and deflection at 2001 stations <= 5 ms (median);
2. the same beam through sympy.physics.continuum_mechanics.beam.Beam in the same run: ratio >= 100x;
3. 6 spans, 8 combinations with pattern loading, full envelopes <= 200 ms (median).

Run: .venv/bin/python benchmarks/bench_analysis.py [--no-sympy]
"""
from __future__ import annotations

import statistics
import sys
import time
from dataclasses import dataclass

import numpy as np

from calckit import Beam
from calckit.analysis import solver

SPANS5 = [6.0, 7.5, 8.0, 7.5, 6.0]
N_STATIONS = 2001


def loads20():
    """20 mixed loads on the 5-span beam: (kind, case, values...) in kN, kN/m, kN*m, m."""
    return [
        ("udl", "D", 8.0, None, None), ("udl", "L", 12.0, 0.0, 13.5), ("udl", "L", 12.0, 21.5, 35.0),
        ("udl", "S", 3.0, 5.0, 30.0), ("udl", "D", 2.0, 13.5, 21.5), ("udl", "L", 6.0, 28.0, 33.0),
        ("P", "D", 20.0, 2.5), ("P", "L", 35.0, 9.0), ("P", "L", 15.0, 11.75), ("P", "D", 40.0, 17.5),
        ("P", "S", 10.0, 19.0), ("P", "L", 25.0, 24.0), ("P", "D", 18.0, 31.2), ("P", "L", 8.0, 33.9),
        ("lin", "S", 0.0, 6.0, 1.0, 5.5), ("lin", "L", 4.0, 9.0, 14.0, 20.5), ("lin", "D", 5.0, 1.0, 22.0, 28.0),
        ("lin", "S", 2.0, 7.0, 29.0, 34.5), ("M", "D", 15.0, 4.0), ("M", "L", -25.0, 26.0),
    ]


def build5(single_case: bool = False) -> Beam:
    b = Beam([f"{s} m" for s in SPANS5], ["pin", "roller", "roller", "roller", "roller", "roller"],
             EI="1.2e5 kN*m**2")
    for ld in loads20():
        kind, case = ld[0], ("D" if single_case else ld[1])
        if kind == "udl":
            _, _, w, a, e = ld
            b.udl(f"{w} kN/m", case, start=None if a is None else f"{a} m", end=None if e is None else f"{e} m")
        elif kind == "P":
            b.point(f"{ld[2]} kN", f"{ld[3]} m", case)
        elif kind == "lin":
            b.linear(f"{ld[2]} kN/m", f"{ld[3]} kN/m", f"{ld[4]} m", f"{ld[5]} m", case)
        else:
            b.moment(f"{ld[2]} kN*m", f"{ld[3]} m", case)
    return b


def median_time(fn, n: int) -> float:
    fn()
    runs = []
    for _ in range(n):
        t = time.perf_counter()
        fn()
        runs.append(time.perf_counter() - t)
    return statistics.median(runs)


def bench_solve_evaluate(single_case: bool, cold: bool, n: int = 300) -> float:
    b = build5(single_case)
    xs = np.linspace(0.0, b.L, N_STATIONS)

    def run():
        b._solution = None  # force a fresh solve
        if cold:
            solver._SYS_CACHE.clear()
        sol = b.solve()
        r = sol["D"] if single_case else sol.combine({"D": 1.2, "L": 1.6, "S": 0.5})
        return r.V_si(xs), r.M_si(xs), r.deflection_si(xs)

    return median_time(run, n)


def bench_sympy(n: int = 1) -> tuple[float, np.ndarray]:
    import sympy as sp
    from sympy.physics.continuum_mechanics.beam import Beam as SB

    def run():
        L = sum(SPANS5)
        sb = SB(sp.nsimplify(L), sp.Float(1.2e8), 1)
        unk = []
        x = 0.0
        for i in range(len(SPANS5) + 1):
            unk.append(sb.apply_support(sp.nsimplify(x), "pin" if i == 0 else "roller"))
            if i < len(SPANS5):
                x += SPANS5[i]
        R = sp.nsimplify
        for ld in loads20():
            kind = ld[0]
            if kind == "udl":
                _, _, w, a, e = ld
                sb.apply_load(R(w * 1e3), R(0 if a is None else a), 0, end=R(L if e is None else e))
            elif kind == "P":
                sb.apply_load(R(ld[2] * 1e3), R(ld[3]), -1)
            elif kind == "lin":
                _, _, w1, w2, a, e = ld
                sb.apply_load(R(w1 * 1e3), R(a), 0, end=R(e))
                sb.apply_load(R((w2 - w1) * 1e3 / (e - a)), R(a), 1, end=R(e))
            else:
                sb.apply_load(-R(ld[2] * 1e3), R(ld[3]), -2)
        sb.solve_for_reaction_loads(*unk)
        xv = sb.variable
        xs = np.linspace(0.0, L, N_STATIONS)
        out = []
        for expr in (sb.shear_force(), sb.bending_moment(), sb.deflection()):
            f = sp.lambdify(xv, expr.rewrite(sp.Piecewise), "numpy")
            out.append(np.asarray(f(xs), dtype=float) * np.ones_like(xs))
        return np.array(out)

    runs, res = [], None
    for _ in range(n):
        t = time.perf_counter()
        res = run()
        runs.append(time.perf_counter() - t)
    return statistics.median(runs), res


@dataclass(frozen=True)
class Combo:
    name: str
    factors: dict
    variable: frozenset = frozenset()


def build6() -> tuple[Beam, list]:
    spans = [6.0, 7.0, 8.0, 8.0, 7.0, 6.0]
    b = Beam([f"{s} m" for s in spans], ["pin"] + ["roller"] * 6, EI="1.5e5 kN*m**2")
    b.udl("9 kN/m", "D").udl("15 kN/m", "L").udl("3 kN/m", "Lr").udl("4 kN/m", "S").udl("-2.5 kN/m", "W")
    b.point("30 kN", "10 m", "L").point("20 kN", "27 m", "L").linear("0 kN/m", "5 kN/m", "30 m", "42 m", "S")
    V = frozenset
    combos = [
        Combo("1.4D", {"D": 1.4}),
        Combo("1.2D + 1.6L + 0.5Lr", {"D": 1.2, "L": 1.6, "Lr": 0.5}, V({"L", "Lr"})),
        Combo("1.2D + 1.6L + 0.5S", {"D": 1.2, "L": 1.6, "S": 0.5}, V({"L", "S"})),
        Combo("1.2D + 1.6Lr + L", {"D": 1.2, "Lr": 1.6, "L": 1.0}, V({"L", "Lr"})),
        Combo("1.2D + 1.6S + L", {"D": 1.2, "S": 1.6, "L": 1.0}, V({"L", "S"})),
        Combo("1.2D + 1.0W + L + 0.5S", {"D": 1.2, "W": 1.0, "L": 1.0, "S": 0.5}, V({"W", "L", "S"})),
        Combo("0.9D + 1.0W", {"D": 0.9, "W": 1.0}, V({"W"})),
        Combo("D + L", {"D": 1.0, "L": 1.0}, V({"L"})),
    ]
    return b, combos


def bench_envelope(n: int = 30) -> tuple[float, object]:
    b, combos = build6()
    holder = {}

    def run():
        b._solution = None
        solver._SYS_CACHE.clear()
        holder["env"] = b.envelope(combos)

    return median_time(run, n), holder


if __name__ == "__main__":
    use_sympy = "--no-sympy" not in sys.argv
    t1c = bench_solve_evaluate(False, cold=True)
    t1w = bench_solve_evaluate(False, cold=False)
    print(f"5 spans, 20 loads in 3 cases, solve + combine + V, M, deflection at {N_STATIONS} stations: "
          f"{t1c * 1e3:.2f} ms cold, {t1w * 1e3:.2f} ms with the system cached (median; goal <= 5 ms)")
    t1s = bench_solve_evaluate(True, cold=True)
    print(f"same beam, the 20 loads as one case (as given to sympy): {t1s * 1e3:.2f} ms (median, cold)")
    t0 = time.perf_counter()
    build5()
    print(f"(building the beam from unit strings, not in the timings above: {(time.perf_counter() - t0) * 1e3:.1f} ms)")
    if use_sympy:
        ts, ref = bench_sympy(1)
        b = build5(True)
        r = b.solve()["D"]
        xs = np.linspace(0.0, b.L, N_STATIONS)
        ours = np.array([r.V_si(xs), r.M_si(xs), r.deflection_si(xs)])
        interior = ~np.isin(np.round(xs, 9), np.round(b.grid().x, 9))
        err = np.max(np.abs(ours[:, interior] - ref[:, interior]) / np.max(np.abs(ref), axis=1, keepdims=True))
        print(f"sympy Beam, same beam and stations: {ts:.2f} s; ratio {ts / t1s:,.0f}x (goal >= 100x); "
              f"max relative difference {err:.1e}")
    t3, h = bench_envelope()
    env = h["env"]
    print(f"6 spans, 8 combinations, pattern loading, full envelopes ({len(env.x)} stations, solve included): "
          f"{t3 * 1e3:.1f} ms (median; goal <= 200 ms)")
