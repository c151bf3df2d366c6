"""Solver speed on the many-member job of ``render_speed.py``, printed side by side in one run:

1. the generated job (N members with loads along them: span, supports, uniform and point loads;
   beam analysis, envelopes, influence lines, zoned schedules in every member; six layouts
   repeated) and the same job with every member's span its own (no layout repeats, so nothing is
   shared through the solver's geometry memo, solve/memo.py) solved in a fresh
   process per round (``pipeline.solve_file``, after one warm-up solve of a demo job), on the
   cold processes' footing (one BLAS thread, bytecode read: benchmarks/footing.py); solve time in
   all and per member, min and median over the rounds. Several ``--src`` trees are timed
   interleaved (A, B, A, B, …) so that each sees the same machine load; the load average from
   ``/proc/loadavg`` is printed before and after;
2. the share of the solve by function (cProfile, own time) on a smaller job of the same kind
   (``--profile-members``, default 20), in this process and tree;
3. with ``--bare``: the bare reportlab script of ``render_speed.py`` laying out the pages the
   report of this job has (10.26 pages per member, 2,232 characters per page and 22.9 cells per
   table, as measured by render_speed.py on 2026-12-02) — the reference the issue's target
   (solve + report ≤ 2.0 × bare) is set against.

The machine is shared (2 cores, other work running): compare the min.

Run:  PYTHONPATH=$PWD python benchmarks/solve_speed.py [--members N] [--rounds N] [--src DIR ...]
      [--profile-members N] [--bare]
"""

from __future__ import annotations

import argparse
import cProfile
import json
import os
import pstats
import statistics
import subprocess
import sys
import tempfile
from pathlib import Path

# the in-process profile on the tool's footing: one BLAS thread, as calcreport/cli.py sets it
for _var in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(_var, "1")

from footing import footing_env  # noqa: E402  # the cold processes' footing (benchmarks/ is on sys.path)
from render_speed import job_text  # noqa: E402  # the generated job (benchmarks/ on sys.path)

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "jobs" / "boathouse-door-header.toml"
#: Density of the report of the generated job, measured by render_speed.py (2026-12-02 runs).
PAGES_PER_MEMBER, CHARS_PER_PAGE, CELLS_PER_TABLE = 2052 / 200, 2232.0, 22.9

_CHILD = r"""
import json, sys, time
from calcreport.pipeline import solve_file
solve_file(sys.argv[2])  # imports, registry and caches of the first solve
t0 = time.perf_counter()
c0 = time.process_time()
solve_file(sys.argv[1])
print(json.dumps({"wall": time.perf_counter() - t0, "cpu": time.process_time() - c0}))
"""


def distinct_job_text(members: int) -> str:
    """The same job with every member's span (so its mesh, stiffness and influence lines) its
    own: render_speed's job repeats six layouts, which the solver's geometry memo shares."""
    # one more inch for every six members
    return job_text(members, span_of=lambda i: 10 + (i % 6) * 2 + (i // 6) / 12)


def loadavg() -> str:
    try:
        return " ".join(Path("/proc/loadavg").read_text().split()[:3])
    except OSError:
        return "n/a"


def solve_once(src: Path, job: Path) -> dict:
    out = subprocess.run(
        [sys.executable, "-c", _CHILD, str(job), str(DEMO)],
        env=footing_env(src),
        cwd=src,  # ``python -c`` puts the working folder first on sys.path: it must be the tree timed
        capture_output=True,
        text=True,
        check=True,
    )
    return json.loads(out.stdout.strip().splitlines()[-1])


def shares(members: int, top: int = 18) -> tuple[float, list[tuple[float, str]]]:
    """Solve a ``members``-member job under cProfile in this process; own-time shares by function."""
    sys.path.insert(0, str(ROOT))
    from calcreport.pipeline import solve_file

    with tempfile.TemporaryDirectory() as tmp:
        job = Path(tmp) / "profile.toml"
        job.write_text(job_text(members), encoding="utf-8")
        solve_file(str(DEMO))
        prof = cProfile.Profile()
        prof.enable()
        solve_file(str(job))
        prof.disable()
    st = pstats.Stats(prof)
    rows = []
    total = 0.0
    for (file, line, name), (_, _, tt, _, _) in st.stats.items():  # type: ignore[attr-defined]
        total += tt
        short = file.split("/calcreport/")[-1] if "/calcreport/" in file else Path(file).name
        rows.append((tt, f"{short}:{line}({name})"))
    rows.sort(reverse=True)
    return total, rows[:top]


def bare_seconds(members: int) -> tuple[float, int]:
    from render_speed import bare_reportlab, matched_rows

    pages = round(PAGES_PER_MEMBER * members)
    rows = matched_rows(CHARS_PER_PAGE, CELLS_PER_TABLE)
    t, got, _ = bare_reportlab(pages, rows, CELLS_PER_TABLE)
    return t, got


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--members", type=int, default=200)
    ap.add_argument("--rounds", type=int, default=3)
    ap.add_argument("--src", type=Path, action="append", help="source tree(s) to time, interleaved")
    ap.add_argument("--profile-members", type=int, default=20, help="0: no profile")
    ap.add_argument("--bare", action="store_true", help="also time the bare reportlab reference")
    args = ap.parse_args()
    srcs = [s.resolve() for s in (args.src or [ROOT])]
    med = statistics.median
    kinds = {"as render_speed.py (6 layouts)": job_text, "every layout distinct": distinct_job_text}
    times: dict[tuple[str, Path], list[dict]] = {(k, s): [] for k in kinds for s in srcs}
    load0 = loadavg()
    with tempfile.TemporaryDirectory() as tmp:
        jobs = {}
        for k, make in kinds.items():
            jobs[k] = Path(tmp) / f"bench-{len(jobs)}-{args.members}.toml"
            jobs[k].write_text(make(args.members), encoding="utf-8")
        for _ in range(args.rounds):
            for k in kinds:
                for s in srcs:
                    times[k, s].append(solve_once(s, jobs[k]))
    load1 = loadavg()
    print(f"{args.members} members, loads along them; fresh process per round, one BLAS thread")
    print(f"load average before / after the timed rounds: {load0} / {load1}")
    print(f"{'job':31} {'tree':36} {'solve min/median (s)':>21} {'CPU min (s)':>11} {'ms/member':>9}")
    for k, s in times:
        w = [t["wall"] for t in times[k, s]]
        c = [t["cpu"] for t in times[k, s]]
        print(
            f"{k:31} {str(s)[-36:]:36} {min(w):10.2f} /{med(w):9.2f} {min(c):11.2f}"
            f" {1000 * min(w) / args.members:9.1f}"
        )
    if args.bare:
        bt, pages = bare_seconds(args.members)
        print(f"bare reportlab, {pages} pages at the report's density: {bt:.2f} s (the target's reference)")
        for k in kinds:
            best = min(t["wall"] for t in times[k, srcs[-1]])
            print(f"  solve / bare, {k}, {srcs[-1].name}: {best / bt:.2f}")
    if args.profile_members:
        total, rows = shares(args.profile_members)
        print(
            f"\nshare of the solve by function ({args.profile_members} members, cProfile own time, this tree):"
        )
        for tt, name in rows:
            print(f"  {100 * tt / total:5.1f} %  {tt:7.3f} s  {name}")


if __name__ == "__main__":
    main()
