"""Building many reports: one job per task, each solved, rendered and written atomically on its own.

``build_one`` is the unit of work (a top-level function, so a process pool can run it): it never
raises for a bad job — it returns the exit code and the line to print. ``run_jobs`` runs the tasks
in order in this process (one worker) or each in its own child process (:mod:`.isolated`: a job
whose process dies or overruns ``--timeout`` fails alone), shows a progress line on a terminal and
returns the outcomes in job order.
"""

from __future__ import annotations

import os
import sys
from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path
from typing import TextIO

__all__ = ["Task", "Outcome", "expand_jobs", "build_one", "run_jobs", "default_workers"]

from ..errors import EXIT_INVALID, EXIT_NG, EXIT_OK


@dataclass(frozen=True)
class Task:
    job: str
    out: Path
    since: str | None = None
    json: bool = False
    allow_outside: bool = False  # template, logo and fonts may lie outside the job's folder
    fabrication: bool = False  # also write the fabrication sheets as <report>-fabrication.pdf


@dataclass(frozen=True)
class Outcome:
    job: str
    code: int  # 0 OK, 1 NG (report written), 2 invalid or not written
    line: str  # "wrote …" for stdout, or the one-line error for stderr


def expand_jobs(items: list[str]) -> list[str]:
    """Job files from the command line; a folder stands for its *.toml files, sorted by name.

    Raises ValueError for a folder without job files.
    """
    jobs: list[str] = []
    for item in items:
        if os.path.isdir(item):
            found = sorted(str(p) for p in Path(item).glob("*.toml") if p.is_file())
            if not found:
                raise ValueError(f"{item}: folder has no *.toml job files")
            jobs += found
        else:
            jobs.append(item)
    return jobs


def default_workers() -> int:
    """Processes for a batch: the cores this process may use."""
    try:
        return max(1, len(os.sched_getaffinity(0)))
    except (AttributeError, OSError):
        return max(1, os.cpu_count() or 1)


def _one_line(text: str) -> str:
    return " ".join(str(text).split())


def build_one(task: Task) -> Outcome:
    """Solve, render and write one report; every failure becomes exit 2 with one line."""
    from ..errors import JobError
    from ..pipeline import solve_file

    try:
        r = solve_file(task.job)
        from ..outputs.report.build import render_pdf
        from ..outputs.report.template import load_template

        tpl = load_template(r.job.settings.template, r.job.path, task.allow_outside)
        keys: frozenset[str] = frozenset()
        mark = ""
        if task.since is not None:
            from ..review.revisions import revision_marks_since

            marks = revision_marks_since(task.job, task.since, r)
            keys, mark = marks.changed_keys, marks.mark
        sheets: dict[str, int] = {}
        pdf = render_pdf(r, tpl, keys, mark, marked_since=task.since or "", fab_sheets=sheets)
        fab = _fabrication(task, r, tpl, sheets) if task.fabrication else None
    except JobError as exc:
        return Outcome(task.job, EXIT_INVALID, _one_line(str(exc)))
    except Exception as exc:  # a defect of ours: still one line, exit 2, nothing written
        return Outcome(
            task.job,
            EXIT_INVALID,
            _one_line(
                f"{task.job}: internal error while building the report ({type(exc).__name__}: {exc}); "
                "please report it with the job file"
            ),
        )
    from ..safewrite import write_set

    files = [(task.out, pdf)]
    if fab is not None:  # the report and its shop copy are moved into place together
        files.append(fab)
    try:
        if task.json:  # the PDF and its JSON are moved into place together, or neither is
            from ..outputs.json_out import dumps, json_path_for, to_dict

            files.append((json_path_for(task.out), dumps(to_dict(r)).encode("utf-8")))
    except Exception as exc:  # a defect of ours: still one line, exit 2, nothing written
        return Outcome(
            task.job,
            EXIT_INVALID,
            _one_line(
                f"{task.job}: internal error while writing the results JSON ({type(exc).__name__}: {exc})"
            ),
        )
    try:
        write_set(files)
    except OSError as exc:
        kept = " and ".join(Path(p).name for p, _ in files)
        return Outcome(
            task.job,
            EXIT_INVALID,
            _one_line(
                f"{task.out}: cannot write the report ({exc.strerror or exc}); nothing was written, "
                f"any earlier {kept} left as they were"
            ),
        )
    extra = f" and {task.out.with_suffix('.json').name}" if task.json else ""
    if fab is not None:
        extra += f" and {Path(fab[0]).name}"
    return Outcome(
        task.job, EXIT_NG if r.status == "NG" else EXIT_OK, f"wrote {task.out}{extra}  [{r.status}]"
    )


def _fabrication(task: Task, r, tpl, sheets: dict[str, int]) -> tuple[Path, bytes]:
    """The separate fabrication PDF of ``--fabrication``; a job with no joint has nothing to
    fabricate and is refused (JobError: one line, exit 2, nothing written)."""
    from ..errors import JobError
    from ..outputs.fabrication_pdf import fabrication_path_for, render_fabrication_pdf

    if not any(m.joints for m in r.members):
        raise JobError(task.job, "", "--fabrication: no member has a joint, so there is nothing to fabricate")
    return Path(fabrication_path_for(task.out)), render_fabrication_pdf(r, sheets, tpl)


class _Progress:
    """'[3/12] building name…' on one \\r-updated line, only when ``stream`` is a terminal."""

    def __init__(self, total: int, stream: TextIO):
        self.total, self.stream, self.done = total, stream, 0
        try:
            self.on = total > 1 and stream.isatty()
        except (AttributeError, ValueError):
            self.on = False
        self.width = 0

    def show(self, text: str) -> None:
        if not self.on:
            return
        line = f"[{self.done}/{self.total}] {text}"[:100]
        self.stream.write("\r" + line.ljust(self.width))
        self.stream.flush()
        self.width = len(line)

    def clear(self) -> None:
        if self.on and self.width:
            self.stream.write("\r" + " " * self.width + "\r")
            self.stream.flush()


def run_jobs(
    tasks: list[Task],
    workers: int,
    stream: TextIO | None = None,
    work: Callable[[Task], Outcome] = build_one,
    quiet: bool = False,
    timeout: float | None = None,
) -> list[Outcome]:
    """Run every task and return outcomes in task order; ``quiet``: no progress line.

    With one worker and no ``timeout`` the tasks run in this process, one after the other.
    Otherwise each runs in its own child process (:mod:`.isolated`), ``workers`` at a time: a
    child that dies fails only its job, and ``timeout`` (seconds) stops a job that runs longer.
    """
    stream = stream if stream is not None else sys.stderr
    progress = _Progress(0 if quiet else len(tasks), stream)
    outcomes: dict[int, Outcome] = {}
    workers = max(1, min(workers, len(tasks)))
    try:
        if workers == 1 and timeout is None:
            for i, t in enumerate(tasks):
                progress.show(f"building {Path(t.job).name}…")
                outcomes[i] = work(t)
                progress.done += 1
        else:
            from .isolated import run_isolated

            if work is build_one:  # import once here: forked children inherit the loaded modules
                from ..jobfile import load_job  # noqa: F401
                from ..outputs.report import build  # noqa: F401
                from ..outputs.report.styles import _register_fallback, register_fonts
                from ..solve import solve_job  # noqa: F401

                register_fonts()  # the bundled fonts, parsed once here rather than in every child
                _register_fallback()

            def failed(i: int, why: str) -> Outcome:
                return Outcome(
                    tasks[i].job, EXIT_INVALID, _one_line(f"{tasks[i].job}: {why}; no report written")
                )

            def done(i: int) -> None:
                progress.done += 1
                progress.show(f"built {Path(tasks[i].job).name}")

            progress.show(f"building {len(tasks)} jobs on {workers} processes…")
            outcomes.update(run_isolated(tasks, workers, work, failed, timeout, done))  # type: ignore[arg-type]
    finally:
        progress.clear()
    return [outcomes[i] for i in range(len(tasks))]
