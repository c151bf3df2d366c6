"""The ``diff`` and ``verify`` commands (registered by :func:`calcreport.cli._add_optional_commands`).

Only argparse wiring lives here; the work is in :mod:`.review_io`, :mod:`.diff`, :mod:`.diff_text`,
:mod:`.change_report` and :mod:`.verify`, imported when a command runs.

Exit codes of ``diff``: 0 no result changed (inputs may have), 1 some result changed, 2 invalid
input or usage. Exit codes of ``verify``: 0 match, 1 mismatch, 2 unreadable PDF or invalid job.
"""

from __future__ import annotations

import sys

__all__ = ["register", "EXIT_SAME", "EXIT_CHANGED", "EXIT_MATCH", "EXIT_MISMATCH", "EXIT_INVALID"]

EXIT_SAME, EXIT_CHANGED = 0, 1
EXIT_MATCH, EXIT_MISMATCH = 0, 1
EXIT_INVALID = 2


def _fail(message: str) -> int:
    print(message.replace("\n", " "), file=sys.stderr)
    return EXIT_INVALID


def _cmd_diff(args) -> int:
    from ..errors import JobError
    from . import review_io
    from .diff import compute_diff
    from .diff_text import diff_to_dict, render_diff
    from .json_out import dumps

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
        from .change_report import write_change_report

        try:
            write_change_report(diff, args.pdf)
        except JobError as exc:  # the new job's report template
            return _fail(str(exc))
        except OSError as exc:
            return _fail(f"{args.pdf}: cannot write the change report ({exc.strerror or exc})")
    sys.stdout.write(dumps(diff_to_dict(diff)) if args.json else render_diff(diff))
    return EXIT_CHANGED if diff.results_changed else EXIT_SAME


def _cmd_verify(args) -> int:
    from ..errors import JobError
    from .verify_pdf import proof_to_dict, prove, render_proof

    try:
        proof = prove(args.pdf, args.job, tuple(args.trust or ()))
    except JobError as exc:
        return _fail(str(exc))
    except ModuleNotFoundError as exc:
        return _fail(f"calcreport verify: needs the {exc.name} package (pip install pyHanko pypdf)")
    if args.json:
        from .json_out import dumps

        sys.stdout.write(dumps(proof_to_dict(proof)))
    else:
        sys.stdout.write(render_proof(proof))
    return EXIT_MATCH if proof.code == 0 else EXIT_MISMATCH


def register(sub) -> None:
    """Add ``diff`` and ``verify`` to the ``calcreport`` sub-command parser."""
    d = sub.add_parser(
        "diff",
        help="show what changed between two revisions of a job",
        description="Compare two revisions of a job file: changed results first (spacing, utilisation, "
        "status, section properties, Q, q, capacities, zoned connector schedules compared whole and every "
        "derivation step, by step key), then "
        'changed inputs by key path ("12 in" and "1 ft" are the same input), then added and removed '
        "members, parts, joints, loads and materials. Values are shown in the new job's units. "
        "Exit 0 no result changed, 1 some result changed, 2 invalid input.",
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
