"""Cold start of `calcreport check` / `build` on the largest demo job against the import floor.

The floor is what any tool on this stack pays before doing anything: starting Python, importing
numpy, pint and reportlab, and building a pint UnitRegistry. It is measured on the same footing as
the tool: pint's registry from its cache (``cache_folder=":auto:"``, as calcreport/units.py
builds it), one BLAS thread (calcreport sets ``OPENBLAS_NUM_THREADS=1`` itself; the floor gets it
in its environment) and bytecode compiled and read back (a warm-up run of every command first,
with a bytecode cache of the run: benchmarks/footing.py). Ratios are taken
pair by pair — floor, check, floor, build in each round — and min and median are printed over the
rounds. The development machine is shared: compare the min. Target: build ≤ 1.5 × floor (issue 7).

Run:  PYTHONPATH=$PWD python benchmarks/cold_start.py [ROUNDS]
"""

from __future__ import annotations

import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from footing import footing_env  # the cold processes' footing (benchmarks/ is on sys.path)

ROOT = Path(__file__).resolve().parent.parent
JOB = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
FLOOR = "import numpy, pint, reportlab; pint.UnitRegistry(cache_folder=':auto:')"


def wall(cmd: list[str], env: dict) -> float:
    """Wall time of one fresh process; its CPU time (user + system) is kept in CPU."""
    t = time.perf_counter()
    p = subprocess.Popen(cmd, stdout=subprocess.DEVNULL, env=env)
    _, status, ru = os.wait4(p.pid, 0)
    if os.waitstatus_to_exitcode(status) not in (0, 1):
        raise SystemExit(f"failed: {' '.join(cmd)}")
    CPU.append(ru.ru_utime + ru.ru_stime)
    return time.perf_counter() - t


CPU: list[float] = []


def main(rounds: int = 7) -> None:
    env = footing_env(ROOT)  # one BLAS thread, bytecode compiled and read (benchmarks/footing.py)
    with tempfile.TemporaryDirectory() as out:
        build = [sys.executable, "-m", "calcreport", "build", str(JOB), "-o", out + "/"]
        check = [sys.executable, "-m", "calcreport", "check", str(JOB)]
        floor = [sys.executable, "-c", FLOOR]
        for cmd in (build, check, floor):  # compile bytecode, warm the file cache and pint's cache
            wall(cmd, env)
        fl, ch, bu, rc, rb, cc, cb = [], [], [], [], [], [], []
        for _ in range(rounds):
            f1, c = wall(floor, env), wall(check, env)
            f2, b = wall(floor, env), wall(build, env)
            cf1, cch, cf2, cbu = CPU[-4:]
            fl += [f1, f2]
            ch.append(c)
            bu.append(b)
            rc.append(c / f1)
            rb.append(b / f2)
            cc.append(cch / cf1)
            cb.append(cbu / cf2)
    med = statistics.median
    print(f"shared machine: min / median of {rounds} rounds, ratios pair by pair; compare the min")
    print(f"import floor ({FLOOR}, 1 BLAS thread): {min(fl):.3f} / {med(fl):.3f} s")
    print(
        f"calcreport check {JOB.name}: {min(ch):.3f} / {med(ch):.3f} s  ratio {min(rc):.2f} / {med(rc):.2f}"
        f"  (cpu-time ratio {min(cc):.2f} / {med(cc):.2f})"
    )
    print(
        f"calcreport build {JOB.name}: {min(bu):.3f} / {med(bu):.3f} s  ratio {min(rb):.2f} / {med(rb):.2f}"
        f"  (cpu-time ratio {min(cb):.2f} / {med(cb):.2f})  (target ≤ 1.50)"
    )


if __name__ == "__main__":
    main(int(sys.argv[1]) if len(sys.argv) > 1 else 7)
