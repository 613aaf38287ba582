"""Run every benchmark script in this folder, one after another, and print their output.

Usage: .venv/bin/python benchmarks/run_all.py  (or `make bench`). Numbers go into benchmarks/README.md by hand,
with the date and the machine; speed goals are checked here, never in the test suite.
"""
from __future__ import annotations

import subprocess
import sys
import time
from pathlib import Path

HERE = Path(__file__).resolve().parent


def main() -> int:
    failed = 0
    for script in sorted(HERE.glob("bench_*.py")):
        print(f"== {script.name}", flush=True)
        t = time.perf_counter()
        rc = subprocess.call([sys.executable, str(script)], cwd=HERE.parent)
        print(f"   ({time.perf_counter() - t:.1f} s, exit {rc})\n", flush=True)
        failed += rc != 0
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
