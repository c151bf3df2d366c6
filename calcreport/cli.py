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

EXIT_OK, EXIT_NG, EXIT_INVALID = 0, 1, 2
TEMPLATE_DIR = Path(__file__).resolve().parent.parent / "templates"
STARTERS = {
    "box": "starter-box-beam.toml",
    "girder": "starter-plate-girder.toml",
    "tee": "starter-glued-tee.toml",
}


class _Parser(argparse.ArgumentParser):
    def error(self, message: str):  # one line, exit 2
        self.exit(EXIT_INVALID, f"{self.prog}: error: {message} (see --help)\n")


def _fail(message: str) -> int:
    print(message.replace("\n", " "), file=sys.stderr)
    return EXIT_INVALID


def solve_file(path: str):
    """Load and solve one job file; raises JobError with file/key/line on bad input."""
    from .errors import JobError
    from .jobfile import load_job
    from .solve import SolveError, solve_job
    from .solve.connectors import ConnectorError

    job = load_job(path)
    try:
        return solve_job(job)
    except (ConnectorError, SolveError) as exc:
        raise JobError(path, exc.key, str(exc)) from None
    except (
        ArithmeticError,
        ValueError,
        TypeError,
        RecursionError,
    ) as exc:  # a defect of ours: still one line, exit 2
        raise JobError(
            path,
            "",
            f"internal error while solving ({type(exc).__name__}: {exc}); please report it with the job file",
        ) from None


def _cmd_check(args) -> int:
    from .errors import JobError

    results, worst = [], EXIT_OK
    for path in args.jobs:
        try:
            results.append(solve_file(path))
        except JobError as exc:
            return _fail(str(exc))
    for r in results:
        worst = max(worst, EXIT_NG if r.status == "NG" else EXIT_OK)
    if args.json:
        from .outputs.json_out import dumps, to_dict

        data = [to_dict(r) for r in results]
        sys.stdout.write(dumps(data[0] if len(data) == 1 else {"jobs": data}))
    else:
        from .outputs.table import render_job

        sys.stdout.write("\n".join(render_job(r) for r in results))
    return worst


def _cmd_new(args) -> int:
    src = TEMPLATE_DIR / STARTERS[args.kind]
    dest = Path(args.path)
    if dest.exists() and not args.force:
        return _fail(f"{dest}: already exists (use --force to overwrite)")
    try:
        text = src.read_text(encoding="utf-8")
    except OSError:
        return _fail(f"{src}: starter template not found (is the templates/ folder beside the package?)")
    tmp = dest.with_name(dest.name + ".tmp")
    tmp.write_text(text, encoding="utf-8")
    os.replace(tmp, dest)
    print(f"wrote {dest} — edit it, then run: calcreport check {dest}")
    return EXIT_OK


def build_parser() -> argparse.ArgumentParser:
    p = _Parser(
        prog="calcreport",
        description="Shear flow and connector spacing for built-up members, "
        "with calculation reports for review and seal.",
    )
    p.add_argument("--version", action="version", version=f"calcreport {__version__}")
    sub = p.add_subparsers(dest="command", parser_class=_Parser, metavar="COMMAND")
    sub.required = True
    c = sub.add_parser(
        "check",
        help="solve job files and print a table per member",
        description="Solve each job file and print, per member, each joint's shear flow, "
        "capacity per row, required and practical spacing and status. "
        "Exit 0 all OK, 1 some NG, 2 invalid input.",
    )
    c.add_argument("jobs", nargs="+", metavar="JOB.toml")
    c.add_argument("--json", action="store_true", help="print results as JSON (schema in the README)")
    c.set_defaults(func=_cmd_check)
    n = sub.add_parser(
        "new",
        help="write a commented starter job file",
        description="Write a commented starter job file from templates/.",
    )
    n.add_argument("path", nargs="?", default="job.toml", help="where to write it (default job.toml)")
    n.add_argument(
        "--kind",
        choices=sorted(STARTERS),
        default="box",
        help="box: nailed plywood box beam; girder: welded steel plate girder; tee: glued T-beam",
    )
    n.add_argument("--force", action="store_true", help="overwrite an existing file")
    n.set_defaults(func=_cmd_new)
    _add_optional_commands(sub)
    return p


def _add_optional_commands(sub) -> None:
    """Commands provided by output packages register themselves here (report, diff, verify)."""
    for module in ("calcreport.outputs.report.cli", "calcreport.outputs.review_cli"):
        try:
            mod = __import__(module, fromlist=["register"])
        except ModuleNotFoundError as exc:
            if exc.name and module.startswith(exc.name):
                continue
            raise
        mod.register(sub)


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    try:
        return args.func(args)
    except KeyboardInterrupt:
        return _fail("interrupted")
    except BrokenPipeError:
        return EXIT_OK


if __name__ == "__main__":
    sys.exit(main())
