"""`calcreport check` must not import the PDF stack (fast start; common practice, no source)."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def test_check_does_not_import_reportlab():
    code = ("import sys, io, contextlib\n"
            "from calcreport.cli import main\n"
            "with contextlib.redirect_stdout(io.StringIO()):\n"
            "    rc = main(['check', 'jobs/boathouse-door-header.toml'])\n"
            "heavy = sorted(m for m in sys.modules if m.split('.')[0] in ('reportlab', 'pypdf'))\n"
            "print(rc, heavy)\n")
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True)
    assert r.returncode == 0, r.stderr
    assert r.stdout.strip() == "0 []", r.stdout
