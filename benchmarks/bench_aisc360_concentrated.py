"""Timing of the AISC 360-22 J10 checks on the numeric path (steps=False): plain python script, prints numbers.

Run: .venv/bin/python benchmarks/bench_aisc360_concentrated.py
"""
from __future__ import annotations

import importlib
import time

import calckit

C = importlib.import_module("calckit.design.aisc360.concentrated")
S = importlib.import_module("calckit.design.aisc360.stiffeners")
A = importlib.import_module("calckit.design.aisc360")


def per_call(fn, n=2000) -> float:
    fn()
    t0 = time.perf_counter()
    for _ in range(n):
        fn()
    return (time.perf_counter() - t0) / n * 1e3


def main() -> None:
    w = calckit.section("W18X50")
    print(f"J10.2+J10.3 (passing, steps=False):          "
          f"{per_call(lambda: C.concentrated(w, 'A992', lb='4 in', Ru='40 kip', steps=False)):.4f} ms")
    print(f"J10.2-J10.5 (passing, steps=False):          "
          f"{per_call(lambda: C.concentrated(w, 'A992', lb='4 in', Ru='40 kip', sidesway='restrained', Lb='20 ft', M='100 kip*ft', opposite=True, steps=False)):.4f} ms")
    print(f"J10.2+J10.3 failing + stiffener sizing:      "
          f"{per_call(lambda: C.concentrated(w, 'A992', lb='3 in', x_end=0, Ru='120 kip', stiffeners=True, steps=False), 500):.4f} ms")
    print(f"stiffener_pair sizing alone (steps=False):   "
          f"{per_call(lambda: S.stiffener_pair(w, 'A992', '150 kip', Rust='60 kip', steps=False), 500):.4f} ms")
    print(f"stiffener_pair with steps:                   "
          f"{per_call(lambda: S.stiffener_pair(w, 'A992', '150 kip', Rust='60 kip'), 50):.4f} ms")
    b = calckit.Beam(["35 ft"], ["pin", "roller"], EI="1 kN*m**2")
    b.udl("0.45 kip/ft", "D").udl("0.75 kip/ft", "L")
    u = b.solve().combine({"D": 1.2, "L": 1.6})
    for P, tag in (("20 kip", "passing"), ("120 kip", "failing, stiffeners sized")):
        D = A.demands(u, bearing=[A.bearing("0 ft", lb="3 in", P=P, name="R1"),
                                  A.bearing("17.5 ft", lb="4 in", P="10 kip", sidesway="restrained")])
        print(f"check_member, demands prepared, {tag:26s} "
              f"{per_call(lambda: A.check_member(w, 'A992', demands=D, steps=False), 300):.4f} ms")


if __name__ == "__main__":
    main()
