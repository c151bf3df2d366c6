"""`calcreport check` must not import the PDF stack (fast start; common practice, no source)."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
HEAVY = "sorted(m for m in sys.modules if m.split('.')[0] in ('reportlab', 'pypdf', 'pyhanko'))"


def run_fresh(args: list[str], report: str, quiet: str = "stdout") -> str:
    """Run ``main(args)`` in a fresh interpreter; print its exit code and ``report`` evaluated after."""
    code = (
        "import sys, io, contextlib\n"
        "from calcreport.cli import main\n"
        f"with contextlib.redirect_{quiet}(io.StringIO()):\n"
        f"    rc = main({args!r})\n"
        f"print(rc, {report})\n"
    )
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True)
    assert r.returncode == 0, r.stderr
    return r.stdout.strip()


def test_check_does_not_import_reportlab():
    assert run_fresh(["check", "jobs/boathouse-door-header.toml"], HEAVY) == "0 []"


def test_build_of_an_invalid_job_stops_before_the_pdf_stack(tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text("[job]\nproject = 1\n", encoding="utf-8")
    out = run_fresh(["build", str(bad), "-o", str(tmp_path / "out") + "/"], HEAVY, quiet="stderr")
    assert out == "2 []", out
    assert not (tmp_path / "out").exists()


def test_cli_limits_blas_threads_unless_the_environment_says_otherwise():
    code = "import os, calcreport.cli; print(os.environ['OPENBLAS_NUM_THREADS'])"
    env = {k: v for k, v in __import__("os").environ.items() if k != "OPENBLAS_NUM_THREADS"}
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, env=env)
    assert r.stdout.strip() == "1", r.stderr
    env["OPENBLAS_NUM_THREADS"] = "3"
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, env=env)
    assert r.stdout.strip() == "3", r.stderr


def test_check_of_a_rectangular_section_does_not_import_shapely():
    # rectangles (plates, lumber, rolled shapes by their box) are handled directly (start-up time)
    assert run_fresh(["check", "jobs/boathouse-door-header.toml"], "'shapely' in sys.modules") == "0 False"


def test_build_leaves_out_modules_a_report_never_uses(tmp_path):
    # start-up time of `build` (issue 15 item 8; common practice, no source): no network stack
    # (xml.sax.saxutils pulled in urllib.request and ssl), no barcode widgets besides the QR
    # encoder, no Japanese codecs (reportlab's QR data modes try Shift-JIS first)
    unused = (
        "ssl",
        "http.client",
        "urllib.request",
        "reportlab.graphics.barcode.widgets",
        "encodings.shift_jis",
    )
    report = f"sorted(m for m in sys.modules if m in {unused!r})"
    out = run_fresh(["build", "jobs/boathouse-door-header.toml", "-o", str(tmp_path) + "/"], report)
    assert out == "0 []", out


def test_patterns_compiled_on_first_use_match_as_compiled_ones():
    # the URL pattern of reportlab's paragraph module is compiled on first use (rl_import): the
    # same matches as the pattern compiled by re itself, and reportlab's own URL splitting works
    import re

    from reportlab.platypus import paragraph

    from calcreport.outputs.report.rl_import import LazyPattern

    pat = paragraph.uri_pat
    source = pat._pattern if isinstance(pat, LazyPattern) else pat.pattern
    compiled = re.compile(source, re.IGNORECASE)
    for uri in ("https://example.org/a/b?c=1", "ftp://10.0.0.1:21/x", "not a link", "www.example.org/x"):
        a, b = pat.match(uri), compiled.match(uri)
        assert (a and a.groups()) == (b and b.groups())
    assert paragraph._uri_split_pairs("https://example.org/a/b")[-1] == ("https://", "example.org/a/b")
