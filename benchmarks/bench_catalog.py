"""Benchmark: load the rolled-section catalog and build every section's properties.

Goal (brief): building all catalog sections' properties takes <= 0.2 s. Plain script; prints numbers.
Run: .venv/bin/python benchmarks/bench_catalog.py
"""
from __future__ import annotations

import statistics
import subprocess
import sys
import time

GOAL_S = 0.2


def cold_run() -> dict[str, float]:
    """Parse the CSVs and build all sections in a fresh interpreter (no caches), times in seconds."""
    code = (
        "import time; t0 = time.perf_counter()\n"
        "import importlib; c = importlib.import_module('calckit.sections.catalog')\n"
        "t1 = time.perf_counter(); rs = c.rows(); t2 = time.perf_counter()\n"
        "secs = [c.section(r.name) for r in rs]; t3 = time.perf_counter()\n"
        "print(len(rs), t1 - t0, t2 - t1, t3 - t2)\n"
    )
    out = subprocess.run([sys.executable, "-c", code], check=True, capture_output=True, text=True).stdout
    n, t_imp, t_parse, t_build = out.split()
    return {"n": int(n), "import": float(t_imp), "parse": float(t_parse), "build": float(t_build)}


def warm_rebuild(repeat: int = 5) -> tuple[int, float]:
    """Rebuild all sections from the cached rows (IShape.from_si only), best of ``repeat``, seconds."""
    import importlib

    c = importlib.import_module("calckit.sections.catalog")
    from calckit.sections.shapes import IShape

    rs = c.rows()
    times = []
    for _ in range(repeat):
        t = time.perf_counter()
        for r in rs:
            IShape.from_si(r.d, r.bf, r.tf, r.tw, r.r, name=r.name)
        times.append(time.perf_counter() - t)
    return len(rs), min(times)


def main() -> None:
    runs = [cold_run() for _ in range(5)]
    n = runs[0]["n"]
    med = {k: statistics.median(r[k] for r in runs) for k in ("import", "parse", "build")}
    total = med["parse"] + med["build"]
    print(f"catalog rows: {n}")
    print(f"cold (median of 5 fresh interpreters): import {med['import'] * 1e3:.1f} ms, "
          f"parse CSVs {med['parse'] * 1e3:.1f} ms, build all sections {med['build'] * 1e3:.1f} ms, "
          f"parse + build {total * 1e3:.1f} ms ({total / n * 1e6:.0f} us per section)")
    n2, best = warm_rebuild()
    print(f"warm rebuild of {n2} sections (IShape.from_si, best of 5): {best * 1e3:.1f} ms")
    print(f"goal <= {GOAL_S * 1e3:.0f} ms for parse + build: {'met' if total <= GOAL_S else 'NOT met'}")


if __name__ == "__main__":
    main()
