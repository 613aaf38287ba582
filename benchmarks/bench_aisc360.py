"""Benchmark of calckit.design.aisc360 (plain script; prints measured numbers, asserts nothing).

Goals (from the design brief): one full member check with steps built (all segments and limit states)
<= 20 ms; the same checks without steps <= 0.3 ms per section (prepared demands reused, as the section
search does).

Case: 35 ft simple span, D 0.45 + L 0.75 kip/ft, LRFD 1.2D + 1.6L, braced at third points (3 segments),
shear, two bearings (web local yielding + crippling each) and two deflection cases: 9 checks per section.

Run: .venv/bin/python benchmarks/bench_aisc360.py
"""
from __future__ import annotations

import statistics
import time

import calckit
from calckit.design import aisc360 as A
from calckit.sections import catalog


def _median_ms(fn, n: int) -> float:
    times = []
    for _ in range(n):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return statistics.median(times) * 1e3


def main() -> None:
    t0 = time.perf_counter()
    b = calckit.Beam(["35 ft"], ["pin", "roller"], EI=calckit.Q_(29000 * 800, "kip*in**2"))
    b.udl("0.45 kip/ft", "D").udl("0.75 kip/ft", "L")
    sol = b.solve()
    u = sol.combine({"D": 1.2, "L": 1.6}, name="1.2D + 1.6L")
    L = 35 * 0.3048
    kw = dict(bracing=[L / 3, 2 * L / 3], bearing=[A.bearing("0 ft", lb="4 in", name="R1"),
                                                    A.bearing("35 ft", lb="4 in", name="R2")],
              deflections={"live": sol["L"], "total": sol.combine({"D": 1, "L": 1})},
              EI=calckit.Q_(29000 * 800, "kip*in**2"))
    w18 = calckit.section("W18X50")
    t_setup = time.perf_counter() - t0

    t = time.perf_counter()
    r = A.check_member(w18, "A992", u, **kw)
    cold = (time.perf_counter() - t) * 1e3
    n_checks = len(r.checks)
    n_steps = len(r.steps) + sum(len(c.steps) for c in r.checks)

    steps_ms = _median_ms(lambda: A.check_member(w18, "A992", u, **kw), 50)
    numeric_ms = _median_ms(lambda: A.check_member(w18, "A992", u, steps=False, **kw), 50)
    demands_ms = _median_ms(lambda: A.demands(u, **kw), 50)

    D = A.demands(u, **kw)
    sections = list(catalog("W"))
    for s in sections[:5]:
        A.check_member(s, "A992", demands=D, steps=False)  # warm
    rounds = []
    for _ in range(5):
        t = time.perf_counter()
        for s in sections:
            A.check_member(s, "A992", demands=D, steps=False)
        rounds.append((time.perf_counter() - t) / len(sections) * 1e3)
    per_section = statistics.median(rounds)
    single_ms = _median_ms(lambda: A.flexure(w18, "A992", Lb="11.7 ft", Cb=1.01, steps=False), 500)
    single_steps_ms = _median_ms(lambda: A.flexure(w18, "A992", Lb="11.7 ft", Cb=1.01), 200)

    print("calckit.design.aisc360 benchmark")
    print(f"  setup (imports, beam solve): {t_setup * 1e3:8.1f} ms")
    print(f"  member check, steps, first call (formula compile): {cold:8.1f} ms")
    print(f"  member check, steps built ({n_checks} checks, {n_steps} records), median: {steps_ms:8.2f} ms"
          f"   goal <= 20 ms")
    print(f"  member check, numeric path, demands rebuilt each call: {numeric_ms:8.3f} ms")
    print(f"  demands(...) alone: {demands_ms:8.3f} ms")
    print(f"  member check, numeric path, prepared demands, {len(sections)} W shapes: "
          f"{per_section:8.4f} ms per section   goal <= 0.3 ms")
    print(f"  flexure() single segment: numeric {single_ms * 1e3:8.1f} us, with steps {single_steps_ms:8.3f} ms")


if __name__ == "__main__":
    main()
