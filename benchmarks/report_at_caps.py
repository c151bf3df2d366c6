"""A job at the caps on the lists that drive page count, solved and rendered in-process.

Issue 13, item 9: notes and assumptions (MAX_LINES lines of MAX_TEXT characters each, at job and
member level), revision history (MAX_HISTORY entries with MAX_TEXT-character descriptions) and
loads (MAX_LOADS on one member, the added ones point loads with long labels). Prints the solve time,
the render time and the number of sheets, next to the target (the report still builds in bounded
time: under 30 s here, against about 1 s for a demo job).

Run:  PYTHONPATH=$PWD python benchmarks/report_at_caps.py
"""

from __future__ import annotations

import tempfile
import time
from pathlib import Path

from calcreport.jobfile.load import MAX_HISTORY, load_job
from calcreport.jobfile.loads import MAX_LOADS
from calcreport.jobfile.reader import MAX_LINES, MAX_TEXT

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"


def _lines(word: str) -> str:
    line = (word + " ") * (MAX_TEXT // (len(word) + 1))
    return "[" + ", ".join(f'"{line.strip()}"' for _ in range(MAX_LINES)) + "]"


def job_at_caps() -> str:
    text = DEMO.read_text(encoding="utf-8")
    history = "".join(
        f'\n[[job.history]]\nmark = "R{i}"\ndate = "2026-11-0{1 + i % 9}"\nby = "QA"\n'
        f'description = "{("revised " * (MAX_TEXT // 8)).strip()}"\n'
        for i in range(MAX_HISTORY)
    )
    text = text.replace("[job]\n", f"[job]\nnotes = {_lines('note')}\n", 1)
    head, rest = text.split("[settings]", 1)
    head = head.split("[[job.history]]", 1)[0]  # the demo's own history entry is replaced
    text = head + history + "\n[settings]" + rest
    text = text.replace(
        "[[member]]\n", f"[[member]]\nassumptions = {_lines('assume')}\nnotes = {_lines('memo')}\n", 1
    )
    loads = "".join(
        f'\n[[member.load]]\ncase = "D"\nkind = "point"\nP = "{10 + i} lbf"\nat = "{(i % 27) + 0.5} ft"\n'
        f'label = "{("label " * 300).strip()}"\n'
        for i in range(MAX_LOADS - 4)
    )
    return text + loads


def main() -> None:
    from calcreport.outputs.report.build import render_pdf
    from calcreport.solve import solve_job

    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / "at-caps.toml"
        path.write_text(job_at_caps(), encoding="utf-8")
        t0 = time.perf_counter()
        result = solve_job(load_job(str(path)))
        t1 = time.perf_counter()
        pdf = render_pdf(result)
        t2 = time.perf_counter()
    sheets = pdf.count(b"/Type /Page\n") or pdf.count(b"/Type /Page ")
    print(
        f"job at the caps ({MAX_LINES} lines × {MAX_TEXT} chars of notes/assumptions, "
        f"{MAX_HISTORY} history entries, {MAX_LOADS} loads on one member): solve {t1 - t0:.2f} s, report {t2 - t1:.2f} s, "
        f"{sheets} sheets, {len(pdf):,} bytes   (target: report < 30 s)"
    )


if __name__ == "__main__":
    main()
