"""Cold start of `calcreport build` on the largest demo job against the import floor.

The floor is what any tool on this stack pays before doing anything: starting Python, importing
numpy, pint and reportlab, and building a pint UnitRegistry. Each figure is the median wall time of
several fresh processes. Target: build ≤ 1.5 × floor (project issue 7).

Run:  PYTHONPATH=$PWD python benchmarks/cold_start.py [RUNS]
"""

from __future__ import annotations

import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
JOB = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
FLOOR = "import numpy, pint, reportlab; pint.UnitRegistry()"


def wall(cmd: list[str], env: dict) -> float:
    t = time.perf_counter()
    subprocess.run(cmd, check=True, stdout=subprocess.DEVNULL, env=env)
    return time.perf_counter() - t


def main(runs: int = 7) -> None:
    env = dict(os.environ, PYTHONPATH=str(ROOT) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    with tempfile.TemporaryDirectory() as out:
        build = [sys.executable, "-m", "calcreport", "build", str(JOB), "-o", out + "/"]
        check = [sys.executable, "-m", "calcreport", "check", str(JOB)]
        floor = [sys.executable, "-c", FLOOR]
        wall(build, env), wall(floor, env)  # warm the file cache and pint's definition cache
        f = statistics.median(wall(floor, env) for _ in range(runs))
        c = statistics.median(wall(check, env) for _ in range(runs))
        b = statistics.median(wall(build, env) for _ in range(runs))
    print(f"import floor (numpy, pint, reportlab, UnitRegistry): {f:.3f} s  (median of {runs})")
    print(f"calcreport check {JOB.name}: {c:.3f} s  ratio {c / f:.2f}")
    print(f"calcreport build {JOB.name}: {b:.3f} s  ratio {b / f:.2f}  (target ≤ 1.50)")


if __name__ == "__main__":
    main(int(sys.argv[1]) if len(sys.argv) > 1 else 7)
