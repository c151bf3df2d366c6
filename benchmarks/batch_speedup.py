"""Batch builds: a folder of 16 jobs (copies of the demo jobs under new names) built with -j 1 and
-j 2 as fresh processes; prints both wall times and the speed-up (ideal: the number of cores).

Run:  PYTHONPATH=$PWD python benchmarks/batch_speedup.py [JOBS]
"""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def main(count: int = 16) -> None:
    env = dict(os.environ, PYTHONPATH=str(ROOT) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    demos = sorted((ROOT / "jobs").glob("*.toml"))
    with tempfile.TemporaryDirectory() as tmp:
        src = Path(tmp) / "jobs"
        src.mkdir()
        for i in range(count):
            d = demos[i % len(demos)]
            shutil.copy(d, src / f"{i:02d}-{d.name}")
        times = {}
        for j in (1, 2):
            out = Path(tmp) / f"out{j}"
            t = time.perf_counter()
            subprocess.run(
                [sys.executable, "-m", "calcreport", "build", str(src), "-o", str(out), "-j", str(j)],
                check=True,
                stdout=subprocess.DEVNULL,
                env=env,
            )
            times[j] = time.perf_counter() - t
        same = all(
            (Path(tmp) / "out1" / p.name).read_bytes() == p.read_bytes()
            for p in (Path(tmp) / "out2").iterdir()
        )
    print(
        f"{count} jobs, -j 1: {times[1]:.2f} s   -j 2: {times[2]:.2f} s   speed-up {times[1] / times[2]:.2f}× "
        f"on {os.cpu_count()} cores; identical PDFs: {same}"
    )


if __name__ == "__main__":
    main(int(sys.argv[1]) if len(sys.argv) > 1 else 16)
