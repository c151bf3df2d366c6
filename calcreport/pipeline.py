"""The one way from a job file to results: read → validate → solve, every failure a located
:class:`~calcreport.errors.JobError` (one line for the user, exit code 2).

The command line, batch builds, ``diff``, ``verify``, ``build --since`` and the tests all come in
here, so the error mapping lives in one place. ``-`` as a path reads the job from standard input.
"""

from __future__ import annotations

import sys
from typing import TYPE_CHECKING, TextIO

from .errors import JobError

if TYPE_CHECKING:
    from .model import Job
    from .solve.results import JobResult

__all__ = ["STDIN", "read_bytes", "load", "solve", "solve_file", "solve_bytes", "check_report_inputs"]

#: The path that stands for standard input.
STDIN = "-"
#: How a job read from standard input is named in messages.
STDIN_LABEL = "<stdin>"


def _max_bytes() -> int:
    from .jobfile.load import MAX_FILE_BYTES

    return MAX_FILE_BYTES


def label_for(path: str) -> str:
    """How ``path`` is named in messages (``<stdin>`` for ``-``)."""
    return STDIN_LABEL if path == STDIN else path


def read_bytes(path: str) -> bytes:
    """The bytes of job file ``path`` (``-``: standard input), refusing files over the size limit."""
    limit = _max_bytes()
    if path == STDIN:
        try:
            data = sys.stdin.buffer.read(limit + 1)
        except (OSError, ValueError, AttributeError) as exc:
            raise JobError(STDIN_LABEL, "", f"cannot read standard input ({exc})") from None
        if len(data) > limit:
            raise JobError(
                STDIN_LABEL, "", f"more than {limit:,} bytes; a job file may have at most {limit:,}"
            )
        return data
    from .safeio import read_input

    return read_input(path, limit, "a job file")


def load(path: str, warnings: TextIO | None | bool = True) -> Job:
    """Read and validate job file ``path`` (``-``: standard input). Keys without effect that the
    reader lets pass with a warning are written to ``warnings`` (one line each; True: standard
    error; None or False: not shown — they stay on ``Job.warnings`` for the report and JSON)."""
    from .errors import one_line
    from .jobfile import load_text

    job = load_text(read_bytes(path), label_for(path))
    stream = sys.stderr if warnings is True else warnings
    if stream:
        for w in job.warnings:
            print(one_line(w.line_text(label_for(path))), file=stream)
    return job


def solve(job: Job) -> JobResult:
    """Solve a validated job; solver and connector errors become a JobError located in the job file.

    A defect of ours (an arithmetic or type error while solving) is still one line naming the
    file, never a traceback.
    """
    from .solve import SolveError, solve_job
    from .solve.connectors import ConnectorError

    try:
        return solve_job(job)
    except (ConnectorError, SolveError) as exc:
        raise JobError(job.path, exc.key, str(exc)) from None
    except (ArithmeticError, LookupError, ValueError, TypeError, AttributeError, RecursionError) as exc:
        raise JobError(
            job.path,
            "",
            f"internal error while solving ({type(exc).__name__}: {exc}); please report it with the job file",
        ) from None


def solve_bytes(data: bytes, label: str) -> JobResult:
    """Validate and solve job-file bytes; ``label`` names them in messages."""
    from .jobfile import load_text

    return solve(load_text(data, label))


def solve_file(path: str) -> JobResult:
    """Read, validate and solve job file ``path`` (``-``: standard input)."""
    return solve(load(path))


def check_report_inputs(job: Job) -> None:
    """Validate what a report build reads besides the job: the report template named in
    ``[settings] template`` with its logo and fonts. Rendering is not tried. The PDF stack is
    imported only when the job names a template."""
    if not job.settings.template.strip():
        return
    from .outputs.report.template import load_template

    load_template(job.settings.template, job.path)
