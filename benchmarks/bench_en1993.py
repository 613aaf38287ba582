"""Speed of calckit.design.en1993 (plain script: prints measured numbers; not a test).

Goals (brief): one full member check with steps <= 20 ms; numeric path <= 0.3 ms per section.
Run: .venv/bin/python benchmarks/bench_en1993.py
"""
from __future__ import annotations

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


def best(fn, n, repeat=5):
    out = []
    for _ in range(repeat):
        t = time.perf_counter()
        for _ in range(n):
            fn()
        out.append((time.perf_counter() - t) / n)
    return min(out)


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
    print(f"full member check with steps, warm:                                     {best(full, 20) * 1e3:8.2f} ms"
          "   (goal <= 20 ms)")

    sections = [calckit.section(n) for n in ("IPE 200", "IPE 240", "IPE 300", "IPE 330", "IPE 400", "IPE 450",
                                             "IPE 500", "HEA 200", "HEA 300", "HEB 300")]

    def numeric_member():
        for s in sections:
            en1993.check_member(s, "S355", x=x, M=M, V=V, zg=0.165, method="rolled", steps=False)

    def numeric_member_zg0():
        for s in sections:
            en1993.check_member(s, "S355", x=x, M=M, V=V, method="rolled", steps=False)

    ann = annex_set("recommended")
    props = [(s.si, material(s.si, "S355")) for s in sections]

    def numeric_core():
        for si, mat in props:
            cl = classify_si(si, mat)
            sh = shear_si(si, mat, ann)
            bending_si(si, mat, ann, cl=cl, sh=sh, V_Ed=60e3)
            ltb_si(si, mat, ann, L=L, C1=1.127, C2=0.454, zg=0.165, method="rolled", cl=cl)

    n = len(sections)
    print(f"numeric check_member (arrays in, C1/C2 by energy solution, z_g != 0): "
          f"{best(numeric_member, 20) / n * 1e3:6.3f} ms per section")
    print(f"numeric check_member (z_g = 0, C1 only):                               "
          f"{best(numeric_member_zg0, 20) / n * 1e3:6.3f} ms per section")
    print(f"numeric section core (classify + shear + bending with V + LTB, C1 given): "
          f"{best(numeric_core, 50) / n * 1e3:6.3f} ms per section   (goal <= 0.3 ms)")


if __name__ == "__main__":
    main()
