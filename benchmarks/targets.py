"""Issue-16 targets side by side with their figures, measured in one run.

Every timed figure is a fresh process (``python -m calcreport check``), on the same footing as the
import floor: one BLAS thread (calcreport sets ``OPENBLAS_NUM_THREADS=1`` itself; the floor gets it
in its environment), pint's registry from its cache (``cache_folder=":auto:"``, as
calcreport/units.py does), bytecode compiled (one warm-up run of each command before timing).
Ratios are taken pair by pair: floor and tool run back to back in each round, and the ratio of
each pair is kept; min and median over the rounds are printed. The machine is shared (2 cores,
other work running): the min is the figure to compare, the median shows the noise.

Cases (invented members of the waterfront scenario):

* every demo job in jobs/ — cold ``check`` ≤ 1.3 × floor;
* the worst-grid member: a 50 ft box beam with two unequal point loads at a 1/4 in increment —
  cold ``check`` ≤ 0.5 s and peak memory (max RSS) ≤ 150 MiB;
* a 10-part member (ten stacked flat laminations, nine nailed joints) — cold ``check`` ≤ 0.6 s;
* per-joint schedule cost on a 20 ft member (in process, memo cleared) ≤ 10 ms.

Run:  PYTHONPATH=$PWD python benchmarks/targets.py [ROUNDS]
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
sys.path.insert(0, str(ROOT))
FLOOR = "import numpy, pint, reportlab; pint.UnitRegistry(cache_folder=':auto:')"

HEAD = """[job]
project = "Harbourside Boardwalk"
number = "HB-BENCH"
subject = "{subject}"
prepared_by = "bench"
date = "2026-12-01"

[settings]
units = "US"
method = "ASD"
spacing_step = "1/4 in"
spacing_max = "{smax}"
spacing_min = "1 in"

[[material]]
id = "df2"
name = "Douglas Fir-Larch No. 2"
family = "wood"
E = "1600 ksi"
Fb = "900 psi"
Fv = "180 psi"
G = 0.50
density = "34 pcf"

[[material]]
id = "ply"
name = "Structural I plywood"
family = "plywood"
E = "1800 ksi"
density = "36 pcf"
"""

BOX = """
[[member]]
id = "G1"
title = "Boardwalk girder G1"
span = "{span}"
self_weight = true

[[member.load]]
case = "D"
kind = "uniform"
w = "40 plf"

[[member.load]]
case = "L"
kind = "uniform"
w = "90 plf"
{points}
[[member.part]]
id = "web_w"
shape = "rect"
width = "23/32 in"
depth = "30 in"
material = "ply"

[[member.part]]
id = "bot"
shape = "lumber"
size = "2x10"
material = "df2"
right_of = "web_w"
align = "bottom"

[[member.part]]
id = "top"
shape = "lumber"
size = "2x10"
material = "df2"
right_of = "web_w"
align = "top"

[[member.part]]
id = "web_e"
shape = "rect"
width = "23/32 in"
depth = "30 in"
material = "ply"
right_of = "bot"
{joints}
"""

JOINT = """
[[member.joint]]
id = "{id}"
holds = [{holds}]
per_row = {n}

[member.joint.connector]
type = "nail"
size = "16d common"
G_side = 0.50
"""

POINT = """
[[member.load]]
case = "{case}"
kind = "point"
P = "{P}"
at = "{at}"
"""


def worst_grid_job() -> str:
    points = POINT.format(case="D", P="700 lbf", at="13 ft") + POINT.format(
        case="L", P="350 lbf", at="31.5 ft"
    )
    joints = JOINT.format(id="top", holds='"top"', n=2) + JOINT.format(id="bot", holds='"bot"', n=2)
    return HEAD.format(subject="worst grid", smax="12 in") + BOX.format(
        span="50 ft", points=points, joints=joints
    )


def ten_part_job() -> str:
    parts = []
    for i in range(10):
        place = 'at = ["0 in", "0 in"]' if i == 0 else f'on = "L{i}"'
        parts.append(
            f'\n[[member.part]]\nid = "L{i + 1}"\nshape = "lumber"\nsize = "2x10"\nflat = true\n'
            f'material = "df2"\n{place}\n'
        )
    joints = "".join(
        JOINT.format(id=f"J{i}", holds=", ".join(f'"L{k}"' for k in range(i + 1, 11)), n=4)
        for i in range(1, 10)
    )
    member = f"""
[[member]]
id = "T1"
title = "Laminated stringer T1"
span = "20 ft"
self_weight = true

[[member.load]]
case = "D"
kind = "uniform"
w = "50 plf"

[[member.load]]
case = "L"
kind = "uniform"
w = "100 plf"
{"".join(parts)}{joints}"""
    return HEAD.format(subject="ten parts", smax="12 in") + member


def run(cmd: list[str], env: dict) -> tuple[float, float, float]:
    """Wall time (s), CPU time (user + system, s) and peak memory (MiB) of one fresh process."""
    t = time.perf_counter()
    p = subprocess.Popen(cmd, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env)
    _, status, ru = os.wait4(p.pid, 0)
    dt = time.perf_counter() - t
    if os.waitstatus_to_exitcode(status) not in (0, 1):
        raise SystemExit(f"failed: {' '.join(cmd)}")
    return dt, ru.ru_utime + ru.ru_stime, ru.ru_maxrss / 1024


def per_joint_ms(repeats: int = 15, point: bool = True) -> tuple[float, float]:
    """In-process cost of one joint's schedule on a 20 ft member at a 1/4 in increment, s_max
    12 in, Z = 3 (optimiser memo and shared maxima cleared): uniform load (symmetric demand), or
    with a point load at 6 ft (no symmetry: chains from both ends)."""
    from calcreport.model import Combination, Load, Support
    from calcreport.solve import schedule_dp
    from calcreport.solve.beam import analyse
    from calcreport.solve.schedule import zoned_schedule
    from calcreport.units import Q_

    try:  # shared range maxima (absent in older trees, for before/after figures)
        from calcreport.solve.schedule_demand import _GRID_CACHE as grid_cache
    except ImportError:
        grid_cache = None
    span = Q_(20, "ft")
    beam = analyse(
        span,
        [Support(Q_(0, "ft")), Support(span)],
        [Load("D", "uniform", Q_(150, "plf"))]
        + (
            [Load("L", "point", Q_(900, "lbf"), at=Q_(6, "ft"))]
            if point
            else [Load("L", "uniform", Q_(60, "plf"))]
        ),
        [Combination("D+L", {"D": 1.0, "L": 1.0})],
        EI=Q_(2.0e9, "lbf*in**2"),
    )
    env = beam.envelope
    best = cpu = float("inf")
    for _ in range(repeats):
        schedule_dp._MEMO.clear()
        if grid_cache is not None:
            grid_cache.clear()
        t, c = time.perf_counter(), time.process_time()
        zoned_schedule(
            env.x,
            env.V_abs * Q_(0.05, "1/in"),
            span,
            Q_(300, "lbf"),
            Q_(0.25, "in"),
            Q_(1, "in"),
            Q_(12, "in"),
            governing=env.V_abs_by,
        )
        best = min(best, time.perf_counter() - t)
        cpu = min(cpu, time.process_time() - c)
    return 1000 * best, 1000 * cpu


def main(rounds: int = 7) -> None:
    env = footing_env(ROOT)  # one BLAS thread, bytecode compiled and read (benchmarks/footing.py)
    py = sys.executable
    with tempfile.TemporaryDirectory() as tmp:
        worst = Path(tmp) / "worst-grid.toml"
        worst.write_text(worst_grid_job())
        ten = Path(tmp) / "ten-part.toml"
        ten.write_text(ten_part_job())
        demos = sorted((ROOT / "jobs").glob("*.toml"))
        floor = [py, "-c", FLOOR]
        cases = {d.name: [py, "-m", "calcreport", "check", str(d)] for d in demos}
        cases["worst-grid (50 ft, 2 point loads, 1/4 in)"] = [py, "-m", "calcreport", "check", str(worst)]
        cases["10-part member"] = [py, "-m", "calcreport", "check", str(ten)]
        for cmd in [floor, *cases.values()]:  # compile bytecode, warm pint's cache and the file cache
            run(cmd, env)
        floors: list[tuple[float, float]] = []
        figures: dict[str, list[tuple[float, float, float, float, float]]] = {k: [] for k in cases}
        for _ in range(rounds):
            for name, cmd in cases.items():
                f, fc, _ = run(floor, env)
                t, tc, mem = run(cmd, env)
                floors.append((f, fc))
                figures[name].append((t, t / f, tc, tc / fc, mem))
    med = statistics.median
    fw, fcpu = zip(*floors)
    print(f"machine shared (2 cores): min / median of {rounds} rounds, ratios pair by pair; compare the min.")
    print("wall = elapsed time; cpu = user + system time of the process (less sensitive to other load)")
    print(
        f"import floor ({FLOOR}): wall {min(fw):.3f} / {med(fw):.3f} s, cpu {min(fcpu):.3f} / {med(fcpu):.3f} s"
    )
    print(f"{'case':44} {'wall s':>13} {'wall ratio':>11} {'cpu s':>13} {'cpu ratio':>11} {'MiB':>5}  target")
    for name, rows in figures.items():
        ts, rs, cs, crs, ms = zip(*rows)
        if name.startswith("worst"):
            target = "≤ 0.50 s, ≤ 150 MiB"
        elif name.startswith("10-part"):
            target = "≤ 0.60 s"
        else:
            target = "ratio ≤ 1.30"
        print(
            f"{name:44} {min(ts):6.3f}/{med(ts):6.3f} {min(rs):5.2f}/{med(rs):5.2f}"
            f" {min(cs):6.3f}/{med(cs):6.3f} {min(crs):5.2f}/{med(crs):5.2f} {max(ms):5.0f}  {target}"
        )
    for point, what in ((False, "uniform load"), (True, "uniform + point load at 6 ft")):
        w, c = per_joint_ms(point=point)
        print(
            f"per-joint schedule, 20 ft member, 1/4 in, {what}: wall {w:.1f} ms, cpu {c:.1f} ms (min of 15)  target ≤ 10 ms"
        )


if __name__ == "__main__":
    main(int(sys.argv[1]) if len(sys.argv) > 1 else 7)
