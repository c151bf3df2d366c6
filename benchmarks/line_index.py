"""The job file's line index on adversarial text, against its target and the pattern it replaced.

Issue 13, item 1: the old key pattern (``\\s*[… ]+?\\s*=``) backtracked cubically on a long run
of spaces. This prints, side by side: the old pattern on one line of N spaces (N = 250, 500, 1000;
it grows ×8 per doubling), and the current index on a 2 MB file of such lines. Target: the 2 MB
file indexed in well under 1 s.

Run:  PYTHONPATH=$PWD python benchmarks/line_index.py
"""

from __future__ import annotations

import re
import time

from calcreport.jobfile.lines import LineIndex

OLD_KEY = re.compile(r"^\s*([A-Za-z0-9_\-\"'. ]+?)\s*=")


def adversarial(size: int = 2_000_000) -> str:
    lines, n = [], 0
    while n < size:
        for line in (
            " " * 8000 + "x",
            "[" + " " * 8000 + "x",
            "a" + " " * 8000 + "=",
            "[[" + " " * 4000 + "]",
        ):
            lines.append(line)
            n += len(line) + 1
    return 'notes = """\n' + "\n".join(lines) + '\n"""\n'


def main() -> None:
    print("old key pattern, one line of N spaces then 'x':")
    for n in (250, 500, 1000):
        t = time.perf_counter()
        OLD_KEY.match(" " * n + "x")
        print(f"  N = {n:5d}: {time.perf_counter() - t:8.3f} s")
    text = adversarial()
    best = min(_time(text) for _ in range(3))
    print(f"current index, {len(text):,} bytes of such lines: {best:.3f} s   (target < 1 s)")


def _time(text: str) -> float:
    t = time.perf_counter()
    LineIndex(text)
    return time.perf_counter() - t


if __name__ == "__main__":
    main()
