"""Wiring of ``diff`` and ``verify`` into the command line: help text, exit-code documentation and
light imports (the PDF stack and pypdf load only when a command needs them; common practice, no
source)."""

from __future__ import annotations

import subprocess
import sys

from review_helpers import ROOT, run


def test_help_documents_exit_codes(capsys):
    for cmd, words in (
        ("diff", ("0 no result changed", "1 some result changed", "2 invalid input")),
        ("verify", ("0 exact match", "1 anything else", "2 unreadable PDF")),
        ("seal", ("0 sealed", "1 refused", "2 invalid input")),
    ):
        try:
            run([cmd, "--help"], capsys)
        except SystemExit as exc:
            assert exc.code == 0
        out = " ".join(capsys.readouterr().out.split())
        for w in words:
            assert w in out, (cmd, w)


def test_parser_does_not_import_pdf_libraries():
    code = (
        "import sys, calcreport.cli as c; c.build_parser(); "
        "print(','.join(m for m in ('reportlab', 'pypdf', 'pyhanko', 'calcreport.review.diff') if m in sys.modules))"
    )
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, check=True)
    assert r.stdout.strip() == ""
