"""A generated 200-member job built to PDF, against bare reportlab laying out the same number of
comparable pages (the same embedded DejaVu fonts, a title block drawn on every page, headings,
paragraphs and ruled tables of paragraph cells of similar density). Both in this process, after imports. Target: ≤ 2×.

Run:  PYTHONPATH=$PWD python benchmarks/report_pages.py [MEMBERS]   (--help for the usage)
"""

from __future__ import annotations

import io
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

HEAD = """[job]
project = "Boardwalk stringers (benchmark)"
number = "BM-200"
revision = "A"
date = "2026-01-01"

[settings]
units = "US"
method = "ASD"

[[material]]
id = "df"
family = "wood"
E = "1600 ksi"
Fv = "180 psi"
"""

MEMBER = """
[[member]]
id = "S{i}"
title = "Stringer S{i}"
shear = "{v} kip"

"""

#: the parts and the joint every benchmark stringer has (also used by render_speed.py)
PARTS = """[[member.part]]
id = "web"
shape = "rect"
width = "3.5 in"
depth = "{d} in"
material = "df"

[[member.part]]
id = "cap"
shape = "rect"
width = "7.25 in"
depth = "1.5 in"
material = "df"
on = "web"

[[member.joint]]
id = "cap-web"
holds = ["cap"]
per_row = 2

[member.joint.connector]
type = "given"
value = "120 lbf"
source = "benchmark value"
"""
MEMBER += PARTS


def job_text(members: int) -> str:
    return HEAD + "".join(
        MEMBER.format(i=i + 1, v=1 + (i % 7) * 0.5, d=7.25 + (i % 4) * 2) for i in range(members)
    )


def bare_reportlab(pages: int) -> float:
    """Lay out ``pages`` pages of headings, paragraphs and 4-column ruled tables with reportlab."""
    from reportlab.lib import colors
    from reportlab.lib.pagesizes import LETTER
    from reportlab.lib.styles import getSampleStyleSheet
    from reportlab.platypus import PageBreak, Paragraph, SimpleDocTemplate, Table, TableStyle

    from calcreport.outputs.report.styles import register_fonts

    fonts = register_fonts()  # the same embedded TrueType fonts as the report
    ss = getSampleStyleSheet()
    for name in ("Heading2", "BodyText"):
        ss[name].fontName = fonts.bold if name == "Heading2" else fonts.regular
    story = []
    words = "shear flow at the interface from the design shear and the first moment of area " * 3
    for p in range(pages):
        story.append(Paragraph(f"Section {p + 1}", ss["Heading2"]))
        for _ in range(3):
            story.append(Paragraph(words, ss["BodyText"]))
        rows = [[Paragraph(t, ss["BodyText"]) for t in ("Quantity", "Formula", "Substituted", "Result")]]
        rows += [
            [
                Paragraph(f"q{k}", ss["BodyText"]),
                Paragraph("q = V·Q / I", ss["BodyText"]),
                Paragraph("1.50 kip × 22.1 in³ / 410 in⁴", ss["BodyText"]),
                Paragraph(f"{80 + k:.1f} lbf/in", ss["BodyText"]),
            ]
            for k in range(14)
        ]
        t = Table(rows, colWidths=[90, 120, 180, 90])
        t.setStyle(TableStyle([("GRID", (0, 0), (-1, -1), 0.3, colors.grey)]))
        story += [t, PageBreak()]

    def furniture(c, doc):
        c.saveState()
        c.rect(54, 690, 504, 70)
        c.setFont(fonts.bold, 9)
        c.drawString(60, 745, f"Benchmark project — sheet {doc.page} of {pages}")
        c.restoreState()

    t0 = time.perf_counter()
    doc = SimpleDocTemplate(io.BytesIO(), pagesize=LETTER, topMargin=130)
    doc.build(story, onFirstPage=furniture, onLaterPages=furniture)
    return time.perf_counter() - t0, doc.page


def main(members: int = 200) -> None:
    from pypdf import PdfReader

    from calcreport.outputs.report.build import render_pdf
    from calcreport.pipeline import solve_file

    with tempfile.TemporaryDirectory() as tmp:
        job = Path(tmp) / "bench-200.toml"
        job.write_text(job_text(members), encoding="utf-8")
        render_pdf(solve_file(str(Path(ROOT) / "jobs" / "boathouse-door-header.toml")))  # fonts, imports
        t0 = time.perf_counter()
        result = solve_file(str(job))
        t1 = time.perf_counter()
        pdf = render_pdf(result)
        t2 = time.perf_counter()
    pages = len(PdfReader(io.BytesIO(pdf)).pages)
    bare, bare_pages = bare_reportlab(pages)
    ours = t2 - t0
    print(
        f"{members}-member job: solve {t1 - t0:.2f} s + report {t2 - t1:.2f} s = {ours:.2f} s for {pages} pages"
    )
    print(f"bare reportlab, {bare_pages} comparable pages: {bare:.2f} s")
    print(f"ratio {ours / bare:.2f} (target ≤ 2.00); report alone {(t2 - t1) / bare:.2f}")


def _members(text: str) -> int:
    """A count of members: a whole number of at least 1."""
    import argparse

    try:
        n = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"expected a whole number of members, got {text!r}") from None
    if n < 1:
        raise argparse.ArgumentTypeError(f"expected at least 1 member, got {n}")
    return n


def parse_args(argv: list[str] | None = None):
    """The command line: ``[MEMBERS]`` (default 200)."""
    import argparse

    ap = argparse.ArgumentParser(
        prog="report_pages.py",
        description="Build a generated job of MEMBERS members to PDF and time it against bare reportlab "
        "laying out the same number of comparable pages (target: at most 2x).",
    )
    ap.add_argument(
        "members",
        nargs="?",
        type=_members,
        default=200,
        metavar="MEMBERS",
        help="members in the job (default 200)",
    )
    return ap.parse_args(argv)


if __name__ == "__main__":
    main(parse_args().members)
