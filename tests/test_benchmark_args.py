"""benchmarks/report_pages.py reads its command line with argparse: ``--help`` prints the usage
and exits 0, a count that is not a whole number of at least 1 is refused with exit code 2 — the
behaviour the Python standard library documents for ``argparse`` (ArgumentParser.exit on -h;
``error()`` exits with status 2). Nothing is timed here (benchmarks print their own figures)."""

from __future__ import annotations

import subprocess
import sys

import pytest

from tests.conftest import ROOT

SCRIPT = ROOT / "benchmarks" / "report_pages.py"


def _run(*args: str) -> subprocess.CompletedProcess:
    return subprocess.run(
        [sys.executable, str(SCRIPT), *args], capture_output=True, text=True, timeout=120, cwd=str(ROOT)
    )


def test_help_prints_usage_and_exits_0():
    done = _run("--help")
    assert done.returncode == 0, done.stderr
    assert done.stdout.startswith("usage: report_pages.py") and "MEMBERS" in done.stdout
    assert "Traceback" not in done.stderr


@pytest.mark.parametrize("bad", ["abc", "0", "-3", "2.5"])
def test_a_bad_count_is_one_line_and_exit_2(bad):
    done = _run(bad)
    assert done.returncode == 2
    assert "Traceback" not in done.stderr and "MEMBERS" in done.stderr


def test_parse_args_default_and_count():
    sys.path.insert(0, str(ROOT / "benchmarks"))
    try:
        import report_pages
    finally:
        sys.path.pop(0)
    assert report_pages.parse_args([]).members == 200
    assert report_pages.parse_args(["7"]).members == 7
