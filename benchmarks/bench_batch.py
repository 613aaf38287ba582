"""Batch speed: 20 demo calcs with -j 2 against bare papermill executing 20 trivial notebooks with -j 2.

    .venv/bin/python benchmarks/bench_batch.py [--n 20] [--jobs 2]

Both are measured in this one run, on this machine, one after the other:

* baseline: ``papermill.execute_notebook`` on a two-cell notebook (parameters cell, one print), from two
  threads, default kernel manager, no archive;
* calckit: ``calckit.batch.run`` on 20 parameter files (the demo project's members, repeated under new
  member marks), two workers: validation, execution, normalising, HTML export, manifest and summary.

The machine is shared and its speed drifts, so the two are measured alternately ``--rounds`` times
(default 2): the ratio printed is best calckit time / best baseline time, with every round shown.
Prints both wall times, the ratio (goal <= 2.0, aim 1.5) and the per-calc figures.
"""
from __future__ import annotations

import argparse
import shutil
import sys
import tempfile
import time
from concurrent.futures import ThreadPoolExecutor
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(REPO))

TRIVIAL = {
    "cells": [
        {"cell_type": "code", "id": "p", "metadata": {"tags": ["parameters"]}, "source": "x = 1",
         "outputs": [], "execution_count": None},
        {"cell_type": "code", "id": "q", "metadata": {}, "source": "print(x * 2)", "outputs": [],
         "execution_count": None},
    ],
    "metadata": {"kernelspec": {"name": "python3", "display_name": "Python 3", "language": "python"},
                 "language_info": {"name": "python"}},
    "nbformat": 4, "nbformat_minor": 5,
}


def baseline(n: int, jobs: int, work: Path) -> float:
    import json
    import logging

    import papermill as pm

    logging.getLogger("papermill").setLevel(logging.ERROR)
    nb = work / "trivial.ipynb"
    nb.write_text(json.dumps(TRIVIAL))

    def one(i):
        pm.execute_notebook(str(nb), str(work / f"out{i}.ipynb"), parameters={"x": i}, progress_bar=False)

    t0 = time.perf_counter()
    with ThreadPoolExecutor(jobs) as ex:
        list(ex.map(one, range(n)))
    return time.perf_counter() - t0


def make_params(n: int, work: Path) -> Path:
    src = REPO / "parameters"
    members = sorted(p for p in src.glob("*.yaml") if p.name != "project.yaml")
    dst = work / "params"
    dst.mkdir()
    shutil.copy(src / "project.yaml", dst / "project.yaml")
    for i in range(n):
        f = members[i % len(members)]
        text = f.read_text()
        lines = [ln if not ln.startswith("member:") else f"{ln.strip()}-{i:02d}" for ln in text.splitlines()]
        (dst / f"{i:02d}-{f.name}").write_text("\n".join(lines) + "\n")
    return dst


def calckit_batch(n: int, jobs: int, work: Path):
    from calckit.batch import run

    params = make_params(n, work)
    t0 = time.perf_counter()
    res = run([params], work / "out", jobs=jobs, progress=lambda s: None)
    return time.perf_counter() - t0, res


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--n", type=int, default=20)
    ap.add_argument("--jobs", type=int, default=2)
    ap.add_argument("--rounds", type=int, default=2)
    a = ap.parse_args(argv)
    tbs, tcs = [], []
    for k in range(a.rounds):
        with tempfile.TemporaryDirectory(prefix="ck-bench-") as td:
            work = Path(td)
            (work / "base").mkdir()
            (work / "ck").mkdir()
            tbs.append(baseline(a.n, a.jobs, work / "base"))
            t, res = calckit_batch(a.n, a.jobs, work / "ck")
            tcs.append(t)
        print(f"round {k + 1}: bare papermill {tbs[-1]:6.2f} s, calckit {tcs[-1]:6.2f} s, "
              f"ratio {tcs[-1] / tbs[-1]:.2f}")
    tb, tc = min(tbs), min(tcs)
    st = {}
    for r in res.rows:
        st[r.status] = st.get(r.status, 0) + 1
    print(f"bare papermill, {a.n} trivial notebooks, -j {a.jobs}: best {tb:7.2f} s  ({tb / a.n:.2f} s per notebook)")
    print(f"calckit batch,  {a.n} demo calcs,        -j {a.jobs}: best {tc:7.2f} s  ({tc / a.n:.2f} s per calc)  "
          f"statuses {st}")
    print(f"ratio calckit / bare papermill (best of {a.rounds} each): {tc / tb:.2f}  (goal <= 2.0, aim 1.5)")
    seconds = sorted(r.seconds for r in res.rows)
    print(f"per-calc execution in the last round (kernel start to end, in parallel): median {seconds[len(seconds) // 2]:.2f} s, "
          f"max {seconds[-1]:.2f} s")
    return 0


if __name__ == "__main__":
    sys.exit(main())
