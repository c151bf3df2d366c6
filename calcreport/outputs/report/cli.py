"""``calcreport build``: one PDF calculation report per job file.

Registered by :func:`calcreport.cli._add_optional_commands`. Nothing from the PDF stack is imported
here at module level, so ``calcreport check`` stays light.
"""

from __future__ import annotations

import sys
from pathlib import Path

__all__ = ["register", "cmd_build", "output_paths"]

EXIT_OK, EXIT_NG, EXIT_INVALID = 0, 1, 2


def register(sub) -> None:
    b = sub.add_parser(
        "build", help="write a PDF calculation report per job file",
        description="Solve each job file and write its calculation report as PDF: title block on every "
        "sheet, seal box, inputs, section drawing to scale, step-by-step derivation, results, sign-off and "
        "limitations. Exit 0 all OK, 1 some NG (the reports are still written and show NG), "
        "2 invalid input (nothing written).")
    b.add_argument("jobs", nargs="+", metavar="JOB.toml")
    b.add_argument("-o", "--output", metavar="OUT",
                   help="where to write: for one job a file path (a path ending in / or an existing folder "
                   "means a folder); for several jobs a folder. Default: ./out/<job-name>.pdf")
    b.add_argument("--since", metavar="REV",
                   help="mark what changed since git revision REV (commit, tag, branch) with a revision "
                   "triangle carrying the job's revision letter (see docs/review.md)")
    b.add_argument("--json", action="store_true",
                   help="also write the results JSON beside each PDF (same name, .json; stable for git)")
    b.set_defaults(func=cmd_build)


def output_paths(jobs: list[str], output: str | None) -> list[Path]:
    """The PDF path of each job (see ``--output``); raises ValueError for a clash or misuse."""
    stems = [Path(j).stem for j in jobs]
    if output is None:
        folder = Path("out")
    else:
        out = Path(output)
        is_folder = output.endswith(("/", "\\")) or out.is_dir() or len(jobs) > 1
        if len(jobs) > 1 and out.exists() and not out.is_dir():
            raise ValueError(f"{output}: with several jobs, -o must be a folder")
        if not is_folder:
            if out.suffix.lower() != ".pdf":
                raise ValueError(f"{output}: expected a .pdf file name or a folder ending in /")
            return [out]
        folder = out
    paths = [folder / f"{s}.pdf" for s in stems]
    seen: dict[Path, str] = {}
    for job, p in zip(jobs, paths):
        if p in seen:
            raise ValueError(f"{job} and {seen[p]} would both write {p}; use separate runs or rename one")
        seen[p] = job
    return paths


def cmd_build(args) -> int:
    from ...cli import solve_file
    from ...errors import JobError

    try:
        paths = output_paths(args.jobs, args.output)
    except ValueError as exc:
        print(f"calcreport build: {exc}", file=sys.stderr)
        return EXIT_INVALID
    results = []
    for path in args.jobs:  # everything is validated before anything is written
        try:
            results.append(solve_file(path))
        except JobError as exc:
            print(str(exc).replace("\n", " "), file=sys.stderr)
            return EXIT_INVALID
    from .build import render_pdf, write_atomic
    from .template import load_template

    rendered = []
    for path, r in zip(args.jobs, results):
        try:
            tpl = load_template(r.job.settings.template, r.job.path)
            keys, mark = frozenset(), ""
            if args.since is not None:
                from ..review_io import revision_marks_since

                marks = revision_marks_since(path, args.since, r)
                keys, mark = marks.changed_keys, marks.mark
        except JobError as exc:
            print(str(exc).replace("\n", " "), file=sys.stderr)
            return EXIT_INVALID
        rendered.append(render_pdf(r, tpl, keys, mark))
    worst = EXIT_OK
    for r, pdf, out in zip(results, rendered, paths):
        try:
            write_atomic(pdf, out)
            if args.json:
                from ..json_out import write_results_json

                write_results_json(r, out)
        except OSError as exc:
            print(f"{out}: cannot write the report ({exc.strerror or exc})", file=sys.stderr)
            return EXIT_INVALID
        print(f"wrote {out}" + (f" and {out.with_suffix('.json').name}" if args.json else "") + f"  [{r.status}]")
        worst = max(worst, EXIT_NG if r.status == "NG" else EXIT_OK)
    return worst
