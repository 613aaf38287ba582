"""Benchmark of calckit.render: rendering a 60-step sheet, and evaluating a cached formula on arrays.

Goals (brief): render a 60-step sheet in <= 0.5 s; evaluate a cached formula on a 300-element array in
<= 50 us per call. Prints measured numbers; run with ``.venv/bin/python benchmarks/bench_render.py``.

Rendering keeps the layout of each formula (TeX widths, tidied forms, broken rows) in caches, so a repeated
render of the same sheet measures the cached layout. Each render is therefore timed twice per repeat:
"warm" (caches as the previous render left them) and "cold" (``calckit.render.texbreak.clear_caches()``
called just before it, as for a sheet whose formulas have not been laid out in this process). Formula
compilation (sympy) is not undone: it is timed by the first build.
"""
from __future__ import annotations

import time

import numpy as np

from calckit.render import Caution, Condition, Formula, Header, Section, Sheet, Summary, check, given
from calckit.render import export as E
from calckit.render import texbreak

FORMULAS = [
    (Formula("M_n", "F_y*Z_x", dims={"M_n": "moment", "F_y": "stress", "Z_x": "modulus"}, ref="AISC 360-22 Eq. F2-1"),
     dict(F_y="50 ksi", Z_x="101 in**3")),
    (Formula("L_p", "1.76*r_y*sqrt(E/F_y)", dims={"L_p": "span", "r_y": "length", "E": "stress", "F_y": "stress"},
             ref="AISC 360-22 Eq. F2-5"), dict(r_y="1.65 in", E="29000 ksi", F_y="50 ksi")),
    (Formula("Delta", "5*w*L**4/(384*E*I_x)", dims={"Delta": "deflection", "w": "line_load", "L": "span",
                                                    "E": "stress", "I_x": "inertia"}, ref="beam formula"),
     dict(w="0.75 kip/ft", L="35 ft", E="29000 ksi", I_x="800 in**4")),
    (Formula("chi_LT", "1/(Phi_LT + sqrt(Phi_LT**2 - beta*lam_bar_LT**2))", ref="EN 1993-1-1 Eq. 6.57"),
     dict(Phi_LT=1.34, beta=0.75, lam_bar_LT=1.288)),
    (Formula("M_n", "C_b*(M_p - (M_p - 0.7*F_y*S_x)*((L_b - L_p)/(L_r - L_p)))",
             dims={"M_n": "moment", "M_p": "moment", "F_y": "stress", "S_x": "modulus", "L_b": "span",
                   "L_p": "span", "L_r": "span"}, ref="AISC 360-22 Eq. F2-2"),
     dict(C_b=1.01, M_p="421 kip*ft", F_y="50 ksi", S_x="88.9 in**3", L_b="11.7 ft", L_p="5.83 ft", L_r="16.9 ft")),
    (Formula("q", "V*Q/I", dims={"q": "shear_flow", "V": "force", "Q": "modulus", "I": "inertia"}),
     dict(V="280 kip", Q="610 in**3", I="42840 in**4")),
]
ZONE = Condition("L_p < L_b <= L_r", dims={"L_p": "span", "L_b": "span", "L_r": "span"}, then="F2-2 applies")


def _scaled(x, k):
    if isinstance(x, str):
        num, _, unit = x.partition(" ")
        return f"{float(num) * (1 + k / 97):.6g} {unit}"
    return x * (1 + k / 997)


def build(n_steps: int = 60):
    recs = []
    k = 0
    while len(recs) < n_steps:
        k += 1
        for f, v in FORMULAS:      # every step gets its own numbers (no repeated formula text)
            recs.append(f.step(**{n: _scaled(x, k) for n, x in v.items()}))
        recs.append(ZONE.step(L_p="5.83 ft", L_b=f"{11.7 + k / 10} ft", L_r="16.9 ft"))
    recs = recs[:n_steps]
    checks = [check(f"Check {i}", given("M_u", "266 kip*ft", "moment"), given("M_c", "305 kip*ft", "moment"))
              for i in range(6)]
    sections = [Section(f"Part {i + 1}", recs[i * 10:(i + 1) * 10], number=str(i + 1)) for i in range(6)]
    hdr = Header(project="Bench", job="0", member="B", title="60-step sheet", inputs={"L": "35 ft"})
    return Sheet(system="US").add(hdr, Caution(), *sections, Summary(checks, header=hdr)), recs


def best(fn, repeat=5):
    ts = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        ts.append(time.perf_counter() - t)
    return min(ts)


def warm_cold(fn, repeat=5, clear=()):
    """(warm times, cold times) in s: per repeat, one run with the caches as they are, then one run right
    after ``texbreak.clear_caches()`` (and the ``clear`` callables)."""
    warm, cold = [], []
    fn()  # fill the caches once
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        warm.append(time.perf_counter() - t)
        texbreak.clear_caches()
        for c in clear:
            c()
        t = time.perf_counter()
        fn()
        cold.append(time.perf_counter() - t)
    return warm, cold


def _ms(ts) -> str:
    return f"best {min(ts) * 1e3:.1f} ms, median {sorted(ts)[len(ts) // 2] * 1e3:.1f} ms"


def main():
    t = time.perf_counter()
    sheet, recs = build()
    t_first = time.perf_counter() - t
    print(f"first build of 60 steps (sympy parse + lambdify + LaTeX, cold): {t_first * 1e3:.0f} ms")
    print(f"rebuild 60 steps (cached formulas, Formula.step with unit strings): {best(lambda: build()) * 1e3:.1f} ms")
    warm, cold = warm_cold(sheet.html)
    print(f"render 60-step sheet to HTML with TeX (notebook display), {len(warm)} repeats:")
    print(f"  warm (layout cached from the previous render): {_ms(warm)}")
    print(f"  cold (texbreak.clear_caches() before each run): {_ms(cold)}")

    warm, cold = warm_cold(sheet.standalone_html, 3, clear=(E.tex_to_mathml.cache_clear,))
    print(f"render 60-step sheet to offline page with MathML, {len(warm)} repeats:")
    print(f"  warm (layout and MathML cached): {_ms(warm)}")
    print(f"  cold (layout and MathML caches cleared before each run): {_ms(cold)}")
    print(f"  of which math font embedding: {'yes, ' + E.find_math_font() if E.find_math_font() else 'no font found'}")

    x = np.linspace(1.0, 2.0, 300)
    for f, name in ((FORMULAS[0][0], "F_y*Z_x"), (FORMULAS[4][0], "F2-2 (7 inputs)"), (FORMULAS[3][0], "chi_LT")):
        scale = {"L_r": 1.5, "Phi_LT": 1.34, "beta": 0.75, "lam_bar_LT": 1.288}
        args = {n: x * scale.get(n, 1.0) if n != "beta" else 0.75 for n in f.names}
        f(**args)
        n = 20000
        t = time.perf_counter()
        for _ in range(n):
            f(**args)
        dt = (time.perf_counter() - t) / n
        print(f"cached formula {name} on a 300-element array: {dt * 1e6:.1f} us per call")


if __name__ == "__main__":
    main()
