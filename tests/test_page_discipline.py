"""Page discipline across the demo reports: rows of a table carried to the next sheet, closing
lines, headings, contents sheet numbers (common typesetting practice, no source — each test says
what it holds to).

Read back with pypdf (an independent PDF reader).
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest

pypdf = pytest.importorskip("pypdf")

from calcreport.outputs.report.flow import MIN_PART, HeadAtTop  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
JOBS = sorted((ROOT / "jobs").glob("*.toml"))


def squash(text: str) -> str:
    return re.sub(r"\s+", "", text)


@pytest.fixture(scope="module")
def built(demo_reports):
    """Every demo job: (result, pdf path, page texts)."""
    return demo_reports


def _table(n: int, row_h: float = 20.0):
    from calcreport.outputs.report.flow import EvenTable

    t = EvenTable(
        [["h"]] + [[str(i)] for i in range(n)], colWidths=[100], rowHeights=[row_h] * (n + 1), repeatRows=1
    )
    t.frame_height = 600.0
    t.wrap(100, 1e6)
    return t


def test_two_tall_rows_are_a_block_not_lone_rows():
    """Rows of four lines (yield modes) may leave two on a sheet: they are over MIN_PART of it."""
    t = _table(8, row_h=50.0)  # 50 pt rows in a 600 pt frame: two rows are 1/6 of the frame
    parts = t.split(100, 50 * 7 + 1)  # header and six rows fit: two rows left for the next sheet
    assert len(parts) == 2 and len(parts[1]._cellvalues) - 1 == 2
    assert 2 * 50.0 >= MIN_PART * 600.0


def test_rows_continuing_a_table_take_its_header_at_the_top_of_a_sheet():
    from reportlab.platypus import Table

    bare = Table([["1.1.9", "a"], ["1.1.14", "b"]])
    headed = Table([["No.", "Step"], ["1.1.9", "a"], ["1.1.14", "b"]])
    f = HeadAtTop(bare, headed, 600.0)
    f.wrap(300, 200)  # under the table above: the bare rows
    assert f._use is bare
    f.wrap(300, 600)  # a fresh sheet: the header first
    assert f._use is headed


CLOSING = ("total ", "Steps ", "Its q(x) chart", "These are not part of the status")


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_no_sheet_opens_on_the_closing_line_of_the_sheet_before(built, stem):
    """Totals, table captions and remarks stay with the rows they close (common practice, no
    source): a sheet's first body line is never one of them."""
    _, _, pages = built[stem]
    for i, t in enumerate(pages[1:], 2):
        first = next((ln.strip() for ln in t.splitlines() if ln.strip()), "")
        assert not first.startswith(CLOSING), (stem, i, first)


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_the_contents_give_the_sheet_each_section_starts_on(built, stem):
    """Every contents entry names the sheet its heading is printed on first (a section mark left
    at the foot of a sheet whose content moved on names the sheet it moved to)."""
    result, _, pages = built[stem]
    from calcreport.outputs.report.build import report_sections

    cover = pages[0]
    titles = [t for _, t in report_sections(result, "Checker's comments" in cover)]
    lines = [" ".join(ln.split()) for ln in cover.split("Contents", 1)[-1].splitlines()]
    for title in titles:
        k = lines.index(" ".join(title.split()))
        sheet = int(lines[k + 1])
        heading = squash(title.split("  ", 1)[-1]) if title[:1].isdigit() else squash(title)
        if heading.startswith("Cover"):
            assert sheet == 1
            continue
        found = [i for i, t in enumerate(pages, 1) if i > 1 and heading in squash(t)]
        if sheet == 1:
            assert heading in squash(cover.split("Contents", 1)[-1]).replace(squash(title), "", 1), title
        else:
            assert found and found[0] == sheet, (title, sheet, found[:3])


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_no_sheet_opens_on_a_bare_row_of_a_derivation_run_on(built, stem):
    """A derivation table that runs on to the next sheet (whole or split) starts there under its
    header row again (common typesetting practice, no source)."""
    _, _, texts = built[stem]
    pages = [t.split("Check (note; source)", 1)[0] for t in texts]
    groups = [set(re.findall(r"^(\d+\.\d+)\.\d+", t, re.M)) for t in pages]
    for i in range(1, len(pages)):
        lines = [ln.strip() for ln in pages[i].splitlines() if ln.strip()]
        bare = re.match(r"^(\d+\.\d+)\.\d+$", lines[0]) if lines else None
        assert not (bare and bare.group(1) in groups[i - 1]), (stem, i + 1, lines[:3])


HEADINGS = re.compile(
    r"^(\d+\.\d+\s+[A-Z][a-z]+ .*|\d+\s+Member .*|Results|Checks|Inputs|Description|Assumptions|Materials|Connectors"
    r"|Parts of the section|Design shear and settings|Section properties|Analysis|Connector design"
    r"|Spacing and schedule|Member checks|Loads and load combinations|Not checked \(\d+\)|Assumed values"
    r"|Limitations and cautions|Review and sign-off|This tool does not check:)$"
)


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_no_sheet_ends_on_a_heading(built, stem):
    """A heading goes with what follows it (common typesetting practice, no source): the last body
    line of a sheet is never a heading."""
    _, _, texts = built[stem]
    for i, t in enumerate(texts[:-1], 1):
        body = t.split("Consulting Structural Engineers", 1)[0]  # the title block's text follows
        lines = [ln.strip() for ln in body.splitlines() if ln.strip()]
        assert lines and not HEADINGS.match(lines[-1]), (stem, i, lines[-2:])
