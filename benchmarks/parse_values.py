"""Cost of reading values: calcreport's own grammar and cached unit look-up against pint's parser.

Prints, side by side in one run:

1. per-value cost of ``calcreport.units.parse`` against pint's full expression parser
   (``ureg.Quantity(text)``, the reference, plus the same dimension check) for typical strings;
2. reading a job with a 2,000-vertex polygon part (4,000 values) with each of the two;
3. cold ``calcreport check`` of every demo job (fresh processes, one BLAS thread, min and
   median), and, with ``--reference-src DIR`` (a source tree of an earlier revision, e.g. from
   ``git archive``), the same runs of that tree taken pair by pair with the ratio.

Run:  PYTHONPATH=$PWD python benchmarks/parse_values.py [--runs N] [--reference-src DIR]
"""

from __future__ import annotations

import argparse
import math
import os
import statistics
import subprocess
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from calcreport.units import Q_, UnitParseError, Written, _dimensionality, parse, parse_value  # noqa: E402

VALUES = [
    ("9.25 in", "length"),
    ("235 mm", "length"),
    ("1600 ksi", "stress"),
    ("250 plf", "line_load"),
    ("5.0 kN/m^3", "weight_density"),
    ("1-1/2 in", "length"),
    ("16'-6 1/2\"", "length"),
    ("15 psf * 14 ft", "line_load"),
]


def pint_reference(text: object, expected: str | None = None) -> Written:
    """What every value cost before: pint's full parser, then the dimension check."""
    q = Q_(text)
    if expected and q.dimensionality != _dimensionality(expected):
        raise UnitParseError(f"expected {expected}")
    return Written(q, False)


def per_call(fn, *args, n: int = 2000, repeat: int = 5) -> float:
    best = math.inf
    for _ in range(repeat):
        t = time.perf_counter()
        for _ in range(n):
            fn(*args)
        best = min(best, (time.perf_counter() - t) / n)
    return best


def polygon_job(n: int = 2000) -> bytes:
    pts = ", ".join(
        f'["{100 + 90 * math.cos(2 * math.pi * k / n):.4f} mm", "{100 + 90 * math.sin(2 * math.pi * k / n):.4f} mm"]'
        for k in range(n)
    )
    return f"""
[job]
project = "Boardwalk rail post, turned section"
[settings]
units = "SI"
[[material]]
id = "fir"
E = "12.4 GPa"
[[member]]
id = "P1"
shear = "4 kN"
[[member.part]]
id = "core"
shape = "polygon"
material = "fir"
points = [{pts}]
[[member.part]]
id = "cap"
shape = "rect"
width = "60 mm"
depth = "20 mm"
material = "fir"
on = "core"
[[member.joint]]
id = "glue"
holds = ["cap"]
[member.joint.connector]
type = "glue"
tau = "1 MPa"
source = "benchmark value"
""".encode()


def load_time(data: bytes, reader_parse) -> float:
    from calcreport.jobfile import load_text, reader

    real = reader.parse_value
    reader.parse_value = reader_parse
    try:
        best = math.inf
        for _ in range(3):
            t = time.perf_counter()
            load_text(data)
            best = min(best, time.perf_counter() - t)
        return best
    finally:
        reader.parse_value = real


def cold(job: Path, src: Path, runs: int) -> list[float]:
    env = dict(os.environ, PYTHONPATH=str(src), OPENBLAS_NUM_THREADS="1")
    cmd = [sys.executable, "-m", "calcreport", "check", str(job)]
    subprocess.run(cmd, stdout=subprocess.DEVNULL, env=env, check=False)  # warm caches
    out = []
    for _ in range(runs):
        t = time.perf_counter()
        subprocess.run(cmd, stdout=subprocess.DEVNULL, env=env, check=False)
        out.append(time.perf_counter() - t)
    return out


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--runs", type=int, default=7)
    ap.add_argument("--reference-src", type=Path, default=None)
    args = ap.parse_args()

    print("1. per value (best of 5 × 2,000 calls)")
    print(f"   {'value':<22} {'calcreport':>11} {'pint parser':>12} {'ratio':>6}")
    for text, dim in VALUES:
        ours = per_call(parse, text, dim)
        try:
            ref = per_call(pint_reference, text, dim)
            ref_text, ratio = f"{ref * 1e6:9.1f} µs", f"{ref / ours:5.1f}×"
        except Exception:
            ref_text, ratio = "refused", "—"
        print(f"   {text:<22} {ours * 1e6:8.1f} µs {ref_text:>12} {ratio:>6}")
    print("   (pint's own rules read 1-1/2 in as 1 − 1/2 in and 16'-6 1/2\" as 16 ft − 6 × 1/2 in: refused)")

    data = polygon_job()
    ours = load_time(data, parse_value)
    ref = load_time(data, pint_reference)
    print("\n2. reading a job with a 2,000-vertex polygon (4,000 values), best of 3")
    print(f"   calcreport {ours:.3f} s   pint parser {ref:.3f} s   ratio {ref / ours:.1f}×")

    print(f"\n3. cold `calcreport check` (fresh processes, {args.runs} runs, OPENBLAS_NUM_THREADS=1)")
    for job in sorted((ROOT / "jobs").glob("*.toml")):
        if args.reference_src is None:
            t = cold(job, ROOT, args.runs)
            print(f"   {job.name:<34} min {min(t):.3f} s  median {statistics.median(t):.3f} s")
            continue
        new, old = [], []
        for _ in range(args.runs):  # pair by pair, alternating, so load on the machine hits both
            new += cold(job, ROOT, 1)
            old += cold(job, args.reference_src, 1)
        ratios = sorted(o / n for o, n in zip(old, new))
        print(
            f"   {job.name:<34} now min {min(new):.3f} / median {statistics.median(new):.3f} s;"
            f" reference min {min(old):.3f} / median {statistics.median(old):.3f} s;"
            f" reference/now min {ratios[0]:.2f} median {statistics.median(ratios):.2f}"
        )


if __name__ == "__main__":
    main()
