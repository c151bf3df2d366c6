"""Shared fixtures: a tiny job-file builder and a CLI runner."""

from __future__ import annotations

import io
import os
import textwrap
from contextlib import redirect_stderr, redirect_stdout
from pathlib import Path

import pytest
from hypothesis import settings as hypothesis_settings

# CI runs the property and fuzz tests with a fixed sequence of cases so a green run stays green;
# local runs explore new cases each time (set CI=true to reproduce CI's cases).
hypothesis_settings.register_profile("ci", derandomize=True, print_blob=True)
if os.environ.get("CI"):
    hypothesis_settings.load_profile("ci")

ROOT = Path(__file__).resolve().parent.parent

HEADER = """
[job]
project = "Test project"
number = "T-1"
revision = "A"
date = "2026-01-01"

[settings]
units = "US"
method = "ASD"
"""

MATERIALS = """
[[material]]
id = "wood"
family = "wood"
E = "1600 ksi"
Fv = "180 psi"
"""


# The reference T-section of several tests: an 8 × 2 in flange on a 2 × 10 in web, one material.
# Closed form (parallel-axis theorem; Gere & Goodno, Mechanics of Materials, 9th ed., §12.5 — from
# memory): ȳ = (16·11 + 20·5)/36 from the bottom; I = 8·2³/12 + 16·(11 − ȳ)² + 2·10³/12 + 20·(5 − ȳ)²;
# Q of the flange about the neutral axis = 16·(11 − ȳ).
TEE_YBAR = (16 * 11 + 20 * 5) / 36
TEE_I = 8 * 8 / 12 + 16 * (11 - TEE_YBAR) ** 2 + 2 * 1000 / 12 + 20 * (5 - TEE_YBAR) ** 2
TEE_Q_FLANGE = 16 * (11 - TEE_YBAR)
TEE_PARTS = """
[[member.part]]
id = "web"
shape = "rect"
width = "2 in"
depth = "10 in"
material = "wood"

[[member.part]]
id = "fl"
shape = "rect"
width = "8 in"
depth = "2 in"
material = "wood"
on = "web"
"""


def job_text(body: str, settings: str = "", materials: str = MATERIALS) -> str:
    """A complete job file around ``body`` (members), with optional extra settings lines."""
    return HEADER + textwrap.dedent(settings) + textwrap.dedent(materials) + textwrap.dedent(body)


@pytest.fixture
def write_job(tmp_path):
    def _write(text: str, name: str = "job.toml") -> str:
        p = tmp_path / name
        p.write_text(text, encoding="utf-8")
        return str(p)

    return _write


def run_cli(*args: str) -> tuple[int, str, str]:
    """Run the command line in-process; returns (exit code, stdout, stderr)."""
    from calcreport.cli import main

    out, err = io.StringIO(), io.StringIO()
    with redirect_stdout(out), redirect_stderr(err):
        try:
            code = main(list(args))
        except SystemExit as exc:  # argparse
            code = exc.code if isinstance(exc.code, int) else 2
    return code, out.getvalue(), err.getvalue()


@pytest.fixture
def cli():
    return run_cli


@pytest.fixture(scope="session")
def demo_reports(tmp_path_factory):
    """Every demo job in jobs/, solved and built once for the session: {stem: (result, pdf path, page
    texts read back with pypdf)}. Shared by the report-order and closing-table tests."""
    pypdf = pytest.importorskip("pypdf")
    from calcreport.outputs.report.build import build_pdf
    from calcreport.pipeline import solve_file

    out = {}
    folder = tmp_path_factory.mktemp("demos")
    for job in sorted((Path(__file__).resolve().parent.parent / "jobs").glob("*.toml")):
        result = solve_file(str(job))
        pdf = folder / f"{job.stem}.pdf"
        build_pdf(result, pdf)
        out[job.stem] = (result, pdf, [p.extract_text() or "" for p in pypdf.PdfReader(str(pdf)).pages])
    return out
