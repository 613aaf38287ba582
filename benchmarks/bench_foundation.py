"""Foundation speed goals (issue: foundation): `import calckit` <= 0.3 s; building every catalog
section's properties <= 0.2 s. Run: .venv/bin/python benchmarks/bench_foundation.py"""
from __future__ import annotations

import statistics
import subprocess
import sys
import time


def import_time(n: int = 7) -> float:
    code = "import time; t=time.perf_counter(); import calckit; print(time.perf_counter()-t)"
    runs = [float(subprocess.check_output([sys.executable, "-c", code], text=True)) for _ in range(n)]
    return statistics.median(runs)


def import_time_process(n: int = 5) -> float:
    runs = []
    for _ in range(n):
        t = time.perf_counter()
        subprocess.check_call([sys.executable, "-c", "import calckit"])
        runs.append(time.perf_counter() - t)
    return statistics.median(runs)


def catalog_load_time() -> tuple[int, float]:
    code = ("import time; t=time.perf_counter(); import calckit.sections as c; "
            "s=c.catalog(); print(len(s), time.perf_counter()-t)")
    out = subprocess.check_output([sys.executable, "-c", code], text=True).split()
    return int(out[0]), float(out[1])


def builtup_time(n: int = 20) -> tuple[float, float]:
    """One BuiltUp construction (IPE 330 + 200 x 15 cover plates), cold (torsion cache cleared) and cached."""
    import calckit.sections as cs
    from calckit.sections.torsion import _solve

    beam = cs.IShape.from_si(0.330, 0.160, 0.0115, 0.0075, 0.018, name="IPE 330")
    top = bot = ("200 mm", "15 mm")
    cs.BuiltUp.cover_plated(beam, top=top, bottom=bot)  # warm up pint and numpy
    cold, warm = [], []
    for _ in range(n):
        _solve.cache_clear()
        t = time.perf_counter()
        cs.BuiltUp.cover_plated(beam, top=top, bottom=bot)
        cold.append(time.perf_counter() - t)
        t = time.perf_counter()
        cs.BuiltUp.cover_plated(beam, top=top, bottom=bot)
        warm.append(time.perf_counter() - t)
    return statistics.median(cold), statistics.median(warm)


if __name__ == "__main__":
    print(f"import calckit (in-process, median of 7): {import_time() * 1e3:.1f} ms  (goal <= 300 ms)")
    print(f"python -c 'import calckit' whole process (median of 5): {import_time_process() * 1e3:.1f} ms")
    try:
        n, t = catalog_load_time()
        print(f"catalog: {n} sections loaded and built, cold process: {t * 1e3:.1f} ms  (goal <= 200 ms)")
    except Exception as exc:  # catalog not available
        print(f"catalog: not measured ({exc})")
    c, w = builtup_time()
    print(f"BuiltUp IPE 330 + 2 cover plates, one construction (median of 20): {c * 1e3:.1f} ms with J/Cw "
          f"solved, {w * 1e3:.1f} ms with the torsion result cached  (goal well under 50 ms)")
