"""``calcreport build``: one PDF calculation report per job file (a folder: each *.toml in it).

Each job is built independently and atomically (:mod:`.batch`), several at a time with ``-j``.

Registered by :func:`calcreport.cli.build_parser`. Nothing from the PDF stack is imported
here at module level, so ``calcreport check`` stays light.
"""

from __future__ import annotations

import os
import sys
from pathlib import Path

__all__ = ["register", "cmd_build", "output_paths"]

from ..errors import EXIT_INVALID, EXIT_OK


def register(sub, common) -> None:
    b = sub.add_parser(
        "build",
        help="write a PDF calculation report per job file (or per job in a folder)",
        description="Solve each job file and write its calculation report as PDF: title block on every "
        "sheet, seal box, inputs, section drawing to scale, step-by-step derivation, results, sign-off and "
        "limitations. A folder stands for every *.toml job in it (sorted by name). Each job is built on "
        "its own and written atomically: an invalid job writes nothing and is listed in a summary at the "
        "end, the other jobs are still written. Exit code: the worst of all jobs — 0 all OK, 1 some NG "
        "(the reports are still written and show NG), 2 some job invalid or not written.",
        parents=[common],
    )
    b.add_argument(
        "jobs",
        nargs="+",
        metavar="JOB.toml|FOLDER",
        help="job files or folders; - reads one job from standard input",
    )
    b.add_argument(
        "-o",
        "--output",
        metavar="OUT",
        help="where to write: for one job, a path ending in .pdf is the file; any other path "
        "is a folder (created if needed); for several jobs a folder. Default: ./out/<job-name>.pdf",
    )
    b.add_argument(
        "-j",
        "--jobs",
        dest="workers",
        type=_workers,
        metavar="N",
        default=None,
        help="build N jobs at a time in separate processes (default: the number of cores)",
    )
    b.add_argument(
        "--since",
        metavar="REV",
        help="mark what changed since git revision REV (commit, tag, branch) with a revision "
        "triangle carrying the job's revision letter (see docs/review.md)",
    )
    b.add_argument(
        "--json",
        action="store_true",
        help="also write the results JSON beside each PDF (same name, .json; stable for git)",
    )
    b.add_argument(
        "--fabrication",
        action="store_true",
        help="also write each job's fabrication sheets (the last sheets of its report: pieces, "
        "fastening per zone, positions from the left end, counts, a QR code with the job file's "
        "SHA-256 and the report sheet) as a PDF of their own beside the report, "
        "<name>-fabrication.pdf; report and shop copy are written together or not at all",
    )
    b.add_argument(
        "--allow-outside",
        action="store_true",
        help="let a job's report template, logo and fonts come from outside the job's folder and "
        "the shipped templates (refused by default)",
    )
    b.add_argument(
        "--timeout",
        type=_seconds,
        metavar="SECONDS",
        default=None,
        help="stop a job that takes longer than SECONDS (each job then runs in its own process); "
        "it fails with one line, the other jobs go on",
    )
    b.set_defaults(func=cmd_build)


def _workers(text: str) -> int:
    import argparse

    try:
        n = int(text)
    except ValueError:
        n = 0
    if not 1 <= n <= 256:
        raise argparse.ArgumentTypeError(f"expected a number of processes from 1 to 256, got {text!r}")
    return n


def _seconds(text: str) -> float:
    import argparse
    import math

    try:
        t = float(text)
    except ValueError:
        t = math.nan
    if not (math.isfinite(t) and 0.1 <= t <= 86_400):
        raise argparse.ArgumentTypeError(f"expected a time limit in seconds from 0.1 to 86400, got {text!r}")
    return t


def output_paths(jobs: list[str], output: str | None, folder: bool = False) -> list[Path]:
    """The PDF path of each job (see ``--output``; ``folder``: -o names a folder even for one job);
    raises ValueError for a clash or misuse."""
    stems = ["job" if j == "-" else Path(j).stem for j in jobs]
    base: Path
    if output is None:
        base = Path("out")
    else:
        out = Path(output)
        is_folder = (
            output.endswith(("/", "\\"))
            or out.is_dir()
            or len(jobs) > 1
            or folder
            or out.suffix.lower() != ".pdf"
        )  # "-o out" names a folder, "-o x.pdf" a file
        if (len(jobs) > 1 or folder) and out.exists() and not out.is_dir():
            raise ValueError(f"{output}: with several jobs, -o must be a folder")
        if not is_folder:
            if out.suffix.lower() != ".pdf":
                raise ValueError(f"{output}: expected a .pdf file name or a folder ending in /")
            return [out]
        base = out
    paths = [base / f"{s}.pdf" for s in stems]
    seen: dict[Path, str] = {}
    for job, p in zip(jobs, paths):
        if p in seen:
            raise ValueError(f"{job} and {seen[p]} would both write {p}; use separate runs or rename one")
        seen[p] = job
    return paths


def fabrication_clash(jobs: list[str], paths: list[Path], with_json: bool) -> None:
    """Refuse (ValueError, one line) a run where a job's fabrication PDF would be another job's
    report, JSON or fabrication PDF (``a.toml`` beside ``a-fabrication.toml``)."""
    from ..outputs.fabrication_pdf import fabrication_path_for

    owner: dict[Path, str] = {}
    for job, p in zip(jobs, paths):
        owner[p] = job
        if with_json:
            owner[p.with_suffix(".json")] = job
    for job, p in zip(jobs, paths):
        fab = Path(fabrication_path_for(p))
        if fab in owner and owner[fab] != job:
            raise ValueError(
                f"--fabrication: the fabrication sheets of {job} would overwrite {fab}, written for "
                f"{owner[fab]}; build them in separate runs or rename one"
            )
        owner[fab] = job


def cmd_build(args) -> int:
    from ..outputs.report.epoch import EpochError, source_date_epoch
    from .batch import Task, default_workers, expand_jobs, run_jobs

    try:
        source_date_epoch()  # a malformed value is refused once, before any job is built
        jobs = expand_jobs(args.jobs)
        paths = output_paths(jobs, args.output, folder=any(os.path.isdir(j) for j in args.jobs))
        fabrication = bool(getattr(args, "fabrication", False))
        if fabrication:
            fabrication_clash(jobs, paths, args.json)
    except (ValueError, EpochError) as exc:
        print(f"calcreport build: {exc}", file=sys.stderr)
        return EXIT_INVALID
    tasks = [
        Task(j, p, args.since, args.json, getattr(args, "allow_outside", False), fabrication)
        for j, p in zip(jobs, paths)
    ]
    workers = 1 if "-" in jobs else (args.workers or default_workers())  # stdin is read here
    if jobs.count("-") > 1:
        print("calcreport build: standard input (-) can be read only once", file=sys.stderr)
        return EXIT_INVALID
    from ..safewrite import termination_handled

    with termination_handled():  # SIGTERM/SIGINT: temporary files removed, children stopped
        outcomes = run_jobs(tasks, workers, quiet=args.quiet, timeout=getattr(args, "timeout", None))
    failed = [o for o in outcomes if o.code == EXIT_INVALID]
    for o in outcomes:
        if o.code != EXIT_INVALID and not args.quiet:
            print(o.line)
    if len(tasks) == 1:
        for o in failed:
            print(o.line, file=sys.stderr)
    elif failed:
        print(f"calcreport build: {len(failed)} of {len(tasks)} jobs not built:", file=sys.stderr)
        for o in failed:
            print(f"  {o.line}", file=sys.stderr)
    return max((o.code for o in outcomes), default=EXIT_OK)
