"""The chart helper for figures along the member (used by the loads outputs)."""

from __future__ import annotations

import pytest

pypdf = pytest.importorskip("pypdf")

from calcreport.outputs.fmt import Display  # noqa: E402
from calcreport.outputs.report.plots import Series, line_chart, nice_ticks, series_values  # noqa: E402
from calcreport.outputs.report.styles import register_fonts  # noqa: E402
from calcreport.units import Q_  # noqa: E402


def test_nice_ticks_cover_the_range_with_round_steps():
    # round steps of 1, 2, 2.5 or 5 × 10^k (common practice, no source)
    for lo, hi in ((0.0, 14.0), (-3.6, 3.6), (0.013, 0.9), (120.0, 120.0)):
        t = nice_ticks(lo, hi)
        assert t[0] <= lo and t[-1] >= hi
        steps = {round(b - a, 9) for a, b in zip(t, t[1:])}
        assert len(steps) == 1


def test_series_values_convert_to_display_units():
    xs, xu = series_values(Display("US"), Q_([0.0, 84.0, 168.0], "inch"))
    assert xs == [0.0, 84.0, 168.0] and xu == "in"
    ys, yu = series_values(Display("SI"), [Q_(1.0, "kip"), Q_(-1.0, "kip")])
    assert yu == "kN" and abs(ys[0] - 4.448) < 1e-3  # 1 kip = 4.448 kN (NIST SP 811, Appendix B)


def test_line_chart_draws_labelled_axes(tmp_path):
    from reportlab.pdfgen.canvas import Canvas

    fonts = register_fonts()
    chart = line_chart(
        [
            Series("maximum", [0, 7, 14], [3.6, 0, -3.6]),
            Series("minimum", [0, 7, 14], [1.0, 0, -1.0], dashed=True),
        ],
        "x along the member (ft)",
        "V (kip)",
        400,
        160,
        fonts,
        title="Shear V envelope",
    )
    out = tmp_path / "c.pdf"
    c = Canvas(str(out), pagesize=(400, 160))
    chart.wrapOn(c, 400, 160)
    chart.drawOn(c, 0, 0)
    c.save()
    text = pypdf.PdfReader(str(out)).pages[0].extract_text()
    for s in ("x along the member (ft)", "V (kip)", "Shear V envelope", "maximum", "minimum"):
        assert s in text


def test_ridge_beam_report_has_the_four_figures(tmp_path):
    """Loads along the member: loading diagram, V/M envelopes, q(x) against n·F/s, zone elevation."""
    from pathlib import Path

    from pypdf import PdfReader

    from calcreport.cli import main

    root = Path(__file__).resolve().parent.parent
    out = tmp_path / "ridge.pdf"
    assert main(["build", str(root / "jobs" / "pavilion-ridge-box-beam.toml"), "-o", str(out)]) in (0, 1)
    text = " ".join((p.extract_text() or "") for p in PdfReader(str(out)).pages)
    text = " ".join(text.split())
    for caption in (
        "Loads by case",
        "Shear V envelope",
        "Bending moment M envelope",
        "demand and provided capacity",
        "Elevation of the member",
        "rows",
    ):
        assert caption in text, caption
