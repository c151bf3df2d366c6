"""The ``diff`` and ``verify`` commands (registered by :func:`calcreport.cli.build_parser`).

Only argparse wiring lives here; the work is in :mod:`calcreport.review` (``revisions``, ``diff``, ``diff_text``,
``change_report``, ``verify``), imported when a command runs.

Exit codes of ``diff``: 0 no result changed (inputs may have), 1 some result changed, 2 invalid
input or usage. Exit codes of ``verify``: 0 match, 1 mismatch, 2 unreadable PDF or invalid job.
"""

from __future__ import annotations

import sys

__all__ = ["register", "EXIT_SAME", "EXIT_CHANGED", "EXIT_MATCH", "EXIT_MISMATCH", "EXIT_INVALID"]

from ..errors import EXIT_INVALID, EXIT_NG, EXIT_OK

EXIT_SAME, EXIT_CHANGED = EXIT_OK, EXIT_NG
EXIT_MATCH, EXIT_MISMATCH = EXIT_OK, EXIT_NG


def _fail(message: str) -> int:
    print(message.replace("\n", " "), file=sys.stderr)
    return EXIT_INVALID


def _cmd_diff(args) -> int:
    from ..errors import JobError
    from ..outputs.json_out import dumps
    from ..review import revisions as review_io
    from ..review.diff import compute_diff
    from ..review.diff_text import diff_to_dict, render_diff

    if args.jobs.count("-") > 1:
        return _fail("calcreport diff: error: standard input (-) can be read only once (see --help)")
    if args.pdf:
        from ..outputs.report.epoch import EpochError, source_date_epoch

        try:
            source_date_epoch()  # the change report's date; refused before anything is read
        except EpochError as exc:
            return _fail(f"calcreport diff: {exc}")
    if args.since is not None and len(args.jobs) != 1:
        return _fail("calcreport diff: error: with --since give exactly one JOB.toml (see --help)")
    if args.since is None and len(args.jobs) != 2:
        return _fail(
            "calcreport diff: error: expected OLD.toml NEW.toml, or JOB.toml --since REV (see --help)"
        )
    try:
        if args.since is not None:
            new = review_io.side_from_file(args.jobs[0])
            old = review_io.side_from_git(args.jobs[0], args.since)
        else:
            old = review_io.side_from_file(args.jobs[0])
            new = review_io.side_from_file(args.jobs[1])
    except JobError as exc:
        return _fail(str(exc))
    diff = compute_diff(old, new)
    if args.pdf:
        from ..review.change_report import write_change_report
        from ..safewrite import termination_handled

        try:
            with termination_handled():  # SIGTERM/SIGINT: the temporary file is removed
                write_change_report(diff, args.pdf, getattr(args, "allow_outside", False))
        except JobError as exc:  # the new job's report template
            return _fail(str(exc))
        except OSError as exc:
            return _fail(f"{args.pdf}: cannot write the change report ({exc.strerror or exc})")
    if not args.quiet:
        sys.stdout.write(dumps(diff_to_dict(diff)) if args.json else render_diff(diff))
    return EXIT_CHANGED if diff.results_changed else EXIT_SAME


def _cmd_verify(args) -> int:
    from ..errors import JobError
    from ..review.verify_pdf import proof_to_dict, prove, render_proof

    try:
        proof = prove(args.pdf, args.job, tuple(args.trust or ()))
    except JobError as exc:
        return _fail(str(exc))
    except ModuleNotFoundError as exc:
        return _fail(f"calcreport verify: needs the {exc.name} package (pip install pyHanko pypdf)")
    if args.json:
        from ..outputs.json_out import dumps

        sys.stdout.write(dumps(proof_to_dict(proof)))
    elif not args.quiet:
        sys.stdout.write(render_proof(proof))
    return EXIT_MATCH if proof.code == 0 else EXIT_MISMATCH


def register(sub, common) -> None:
    """Add ``diff`` and ``verify`` to the ``calcreport`` sub-command parser."""
    d = sub.add_parser(
        "diff",
        help="show what changed between two revisions of a job",
        description="Compare two revisions of a job file: changed results first (spacing, utilisation, "
        "status, section properties, Q, q, capacities, zoned connector schedules compared whole and every "
        "derivation step, by step key), then "
        'changed inputs by key path ("12 in" and "1 ft" are the same input), then added and removed '
        "members, parts, joints, loads and materials. Values are shown in the new job's units. "
        "Exit 0 no result changed, 1 some result changed, 2 invalid input (one that does not solve).",
        parents=[common],
    )
    d.add_argument(
        "jobs", nargs="+", metavar="JOB.toml", help="OLD.toml NEW.toml; or one JOB.toml with --since"
    )
    d.add_argument(
        "--since",
        metavar="REV",
        help="compare JOB.toml with its version at git revision REV (commit, tag, branch, HEAD~1)",
    )
    d.add_argument("--json", action="store_true", help="print the diff as JSON (schema in docs/review.md)")
    d.add_argument("--pdf", metavar="OUT.pdf", help="also write a change report PDF for reviewers")
    d.add_argument(
        "--allow-outside",
        action="store_true",
        help="with --pdf: let the report template, logo and fonts come from outside the job's folder "
        "and the shipped templates (refused by default)",
    )
    d.set_defaults(func=_cmd_diff)
    v = sub.add_parser(
        "verify",
        help="prove that a PDF report is exactly what this job file builds (and check its seals)",
        description="Rebuild the report of the job file in memory and compare it byte for byte with the "
        "PDF as built; name the sheets that differ; list every update made after the build and check "
        "each digital seal (integrity, certificate chain against --trust roots, what it covers). "
        "A report from another calcreport version is compared by page text only (a weaker check). "
        "Exit 0 exact match (and every seal intact, trusted and covering the file), 1 anything else, "
        "2 unreadable PDF or invalid job file. See docs/review.md.",
        parents=[common],
    )
    v.add_argument("pdf", metavar="REPORT.pdf")
    v.add_argument("job", metavar="JOB.toml")
    v.add_argument(
        "--trust",
        action="append",
        metavar="CERT.pem",
        help="a certificate authority to trust for seals (PEM or DER; repeat for several)",
    )
    v.add_argument("--json", action="store_true", help="print the findings as JSON (see docs/review.md)")
    v.set_defaults(func=_cmd_verify)
