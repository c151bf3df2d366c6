"""Command line: thin layer that parses arguments, calls the library and maps errors to exit codes.

Exit codes: 0 all OK; 1 at least one NG; 2 invalid job file or usage (nothing written).
Heavy modules (the PDF stack) are imported only by the commands that need them.
"""

from __future__ import annotations

import argparse
import os
import sys
from pathlib import Path

# The matrices here are small (a beam's stiffness, a few hundred unknowns): a multi-threaded BLAS
# only pays thread start-up, ~0.3 s on a cold run with a busy core (benchmarks/cold_start.py).
# Set before anything imports numpy; an explicit setting in the environment wins.
for _var in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(_var, "1")

from . import __version__  # noqa: E402

__all__ = ["main"]

from .errors import EXIT_INVALID, EXIT_NG, EXIT_OK  # noqa: E402
from .resources import STARTERS  # noqa: E402


class _Parser(argparse.ArgumentParser):
    def error(self, message: str):  # one line, exit 2
        self.exit(EXIT_INVALID, f"{self.prog}: error: {message} (see --help)\n")


def _fail(message: str) -> int:
    print(message.replace("\n", " "), file=sys.stderr)
    return EXIT_INVALID


def _cmd_check(args) -> int:
    from .errors import JobError
    from .outputs.json_out import dumps, to_dict
    from .outputs.table import render_job
    from .pipeline import check_report_inputs, solve_file

    if args.jobs.count("-") > 1:
        return _fail("calcreport check: error: standard input (-) can be read only once (see --help)")
    results, failed = [], []
    for path in args.jobs:
        try:
            r = solve_file(path)
            check_report_inputs(r.job)
        except JobError as exc:
            failed.append(str(exc))
            continue
        results.append(r)
    worst = max((EXIT_NG if r.status == "NG" else EXIT_OK for r in results), default=EXIT_OK)
    if results and not args.quiet:
        if args.json:
            data = [to_dict(r) for r in results]
            sys.stdout.write(dumps(data[0] if len(data) == 1 and not failed else {"jobs": data}))
        else:
            sys.stdout.write("\n".join(render_job(r) for r in results))
    if len(args.jobs) == 1:
        for line in failed:
            print(line, file=sys.stderr)
    elif failed:
        print(f"calcreport check: {len(failed)} of {len(args.jobs)} jobs invalid:", file=sys.stderr)
        for line in failed:
            print(f"  {line}", file=sys.stderr)
    return EXIT_INVALID if failed else worst


def _cmd_new(args) -> int:
    from .resources import starter_text

    dest = Path(args.path)
    if args.path == "-":
        sys.stdout.write(starter_text(args.kind))
        return EXIT_OK
    if dest.exists() and not args.force:
        return _fail(f"{dest}: already exists (use --force to overwrite)")
    from .safewrite import write_atomic

    try:
        write_atomic(starter_text(args.kind), dest)
    except OSError as exc:
        return _fail(f"{dest}: cannot write the file ({exc.strerror or exc})")
    if not args.quiet:
        print(f"wrote {dest} — edit it, then run: calcreport check {dest}")
    return EXIT_OK


def _common() -> _Parser:
    """Options every command takes."""
    common = _Parser(add_help=False)
    common.add_argument(
        "-q", "--quiet", action="store_true", help="print only errors (the exit code tells the outcome)"
    )
    return common


def build_parser() -> argparse.ArgumentParser:
    p = _Parser(
        prog="calcreport",
        description="Shear flow and connector spacing for built-up members, "
        "with calculation reports for review and seal.",
    )
    p.add_argument("--version", action="version", version=f"calcreport {__version__}")
    common = _common()
    sub = p.add_subparsers(dest="command", parser_class=_Parser, metavar="COMMAND")
    sub.required = True
    c = sub.add_parser(
        "check",
        help="solve job files and print a table per member",
        description="Solve each job file and print, per member, each joint's shear flow, "
        "capacity per row, required and practical spacing and status. "
        "Also reads the report template (with its logo and fonts) that build would use. "
        "An invalid job is listed and the next one is checked. "
        "Exit 0 all OK, 1 some NG, 2 some job invalid.",
        parents=[common],
    )
    c.add_argument("jobs", nargs="+", metavar="JOB.toml", help="job files; - reads one from standard input")
    c.add_argument(
        "--json",
        action="store_true",
        help="print results as JSON (its JSON Schema: calcreport schema --results)",
    )
    c.set_defaults(func=_cmd_check)
    n = sub.add_parser(
        "new",
        help="write a commented starter job file",
        description="Write a commented starter job file (- prints it on standard output).",
        parents=[common],
    )
    n.add_argument("path", nargs="?", default="job.toml", help="where to write it (default job.toml)")
    n.add_argument(
        "--kind",
        choices=sorted(STARTERS),
        default="box",
        help="box: nailed plywood box beam; girder: welded steel plate girder; tee: glued T-beam; "
        "plies: two-ply nailed header, top-loaded; side-loaded: three-ply beam loaded on one face; "
        "flitch: steel plate bolted between two timbers",
    )
    n.add_argument("--force", action="store_true", help="overwrite an existing file")
    n.set_defaults(func=_cmd_new)
    from .commands import build, review, schema, seal

    build.register(sub, common)
    review.register(sub, common)
    seal.register(sub, common)
    schema.register(sub, common)
    return p


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    try:
        return args.func(args)
    except KeyboardInterrupt as exc:  # also SIGTERM during a build (safewrite.Terminated)
        return _fail(f"calcreport: {exc}" if str(exc) else "interrupted")
    except BrokenPipeError:
        return EXIT_OK


if __name__ == "__main__":
    sys.exit(main())
