"""The ``seal`` command (registered by :func:`calcreport.cli._add_optional_commands`).

Only argparse wiring lives here; the work is in :mod:`.seal`, imported when the command runs.
Exit codes: 0 sealed; 1 not sealed because ``--job`` was given and the report is not exactly what
that job builds; 2 invalid input (unreadable report, certificate or key, wrong passphrase).
"""

from __future__ import annotations

import sys

__all__ = ["register"]

EXIT_OK, EXIT_REFUSED, EXIT_INVALID = 0, 1, 2


def _fail(message: str) -> int:
    print(message.replace("\n", " "), file=sys.stderr)
    return EXIT_INVALID


def _cmd_seal(args) -> int:
    from ..errors import JobError

    try:
        from ..review import seal as sealing
    except ModuleNotFoundError as exc:  # pragma: no cover - pyHanko is a dependency
        return _fail(f"calcreport seal: needs the {exc.name} package (pip install pyHanko)")
    try:
        if args.job:
            from ..review.verify_pdf import prove, render_proof

            proof = prove(args.pdf, args.job)
            if not proof.exact and not all(
                f.status in ("ok", "note") or f.check.startswith("seal") for f in proof.findings
            ):
                sys.stdout.write(render_proof(proof))
                print(
                    f"calcreport seal: {args.pdf} is not exactly what {args.job} builds; not sealed",
                    file=sys.stderr,
                )
                return EXIT_REFUSED
        ask = sealing.passphrase_source(args.passphrase_env, sys.stdin is not None and sys.stdin.isatty())
        cred = sealing.load_credentials(args.cert, args.key, tuple(args.chain or ()), ask)
        out = args.output or args.pdf
        res = sealing.seal_pdf(args.pdf, out, cred, field=args.field, tsa_url=args.tsa)
    except JobError as exc:
        return _fail(str(exc))
    where = f"field {res.field!r} in the seal box" if res.visible else f"new invisible field {res.field!r}"
    print(f"sealed {res.out}: {where}; stamp: {' / '.join(res.lines)}")
    return EXIT_OK


def register(sub, common) -> None:
    """Add ``seal`` to the ``calcreport`` sub-command parser."""
    s = sub.add_parser(
        "seal",
        parents=[common],
        allow_abbrev=False,  # "--passphrase …" must not pass for --passphrase-env
        help="apply a digital seal (PAdES signature) to a calculation report",
        description="Sign a calculation report into the signature field its cover reserves in the seal "
        "box (a PAdES baseline signature, written as an incremental update: the report as built stays "
        "byte-identical). The stamp shows the engineer's name, licence number and state/province from "
        "the job ([job] engineer, licence, jurisdiction) or the certificate, and the signing time. "
        "A second seal (a checker's) goes into a new invisible field. A passphrase is read from the "
        "environment variable named by --passphrase-env or asked for at a prompt, never given as an "
        "argument. Exit 0 sealed, 1 refused (--job: the report is not what the job builds), 2 invalid "
        "input. See docs/review.md.",
    )
    s.add_argument("pdf", metavar="REPORT.pdf")
    s.add_argument(
        "--cert",
        required=True,
        metavar="FILE",
        help="signer's certificate (PEM or DER), or a PKCS#12 file (.p12)",
    )
    s.add_argument(
        "--key", metavar="FILE", help="signer's private key (PEM or DER); omit for a PKCS#12 --cert"
    )
    s.add_argument(
        "--chain", action="append", metavar="CERT.pem", help="intermediate certificates to embed (repeatable)"
    )
    s.add_argument(
        "--passphrase-env",
        metavar="NAME",
        help="read the key's passphrase from the environment variable NAME (else a prompt asks)",
    )
    s.add_argument(
        "-o",
        "--output",
        metavar="OUT.pdf",
        help="write the sealed report here (default: in place, atomically)",
    )
    s.add_argument("--field", metavar="NAME", help="sign into this field (default: the seal box's field)")
    s.add_argument("--job", metavar="JOB.toml", help="first prove the report is exactly what this job builds")
    s.add_argument(
        "--tsa",
        metavar="URL",
        help="timestamp authority to add a trusted time (PAdES B-T); none is contacted otherwise",
    )
    s.set_defaults(func=_cmd_seal)
