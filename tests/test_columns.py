"""Two-column lists (assumed values, not-checked items, what the tool does not check).

Heights are compared with reportlab's own Paragraph layout (a general-purpose reference: each
unit's height is the sum of its paragraphs' ``wrap`` at the column width plus their spaces);
the reading order (down the left column, then the right; on across sheets) is common
typesetting practice, no source.
"""

from __future__ import annotations

import io

import pytest

pypdf = pytest.importorskip("pypdf")

from reportlab.lib.styles import ParagraphStyle  # noqa: E402
from reportlab.platypus import Paragraph, SimpleDocTemplate  # noqa: E402

from calcreport.outputs.report.columns import MIN_PART, MIN_UNITS, Columns  # noqa: E402

STYLE = ParagraphStyle("t", fontName="Helvetica", fontSize=8, leading=10, spaceAfter=2)


def _units(n: int, words: int = 12) -> list[list[Paragraph]]:
    return [[Paragraph(f"item{k:03d} " + "word " * (words + k % 7), STYLE)] for k in range(n)]


def _unit_height(u: list[Paragraph], width: float) -> float:
    return sum(p.wrap(width, 1e9)[1] + p.getSpaceBefore() + p.getSpaceAfter() for p in u)


def test_the_last_sheet_is_balanced_and_keeps_the_reading_order():
    units = _units(9)
    cols = Columns(units, gap=10)
    w, h = cols.wrap(410, 1000)
    left, right = cols._cols
    assert left + right == list(range(9))  # every unit once, in order: left column first
    cw = (410 - 10) / 2
    hl = sum(_unit_height(units[k], cw) for k in left)
    hr = sum(_unit_height(units[k], cw) for k in right)
    assert h == pytest.approx(max(hl, hr))
    # no other cut gives a shorter taller column
    heights = [_unit_height(u, cw) for u in units]
    best = min(max(sum(heights[:c]), sum(heights[c:])) for c in range(1, 9))
    assert h == pytest.approx(best)


def test_a_list_longer_than_the_sheet_fills_both_columns_then_runs_on():
    units = _units(60)
    cols = Columns(units, gap=10)
    cw = 200.0
    heights = [_unit_height(u, cw) for u in units]
    room = 300.0
    first, rest = cols.split(410, room)
    left, right = first._cols
    assert left and right and left + right == list(range(len(left) + len(right)))
    assert sum(heights[k] for k in left) <= room + 1e-6
    assert sum(heights[k] for k in right) <= room + 1e-6
    # the next unit would not have fitted under the right column
    assert sum(heights[k] for k in right) + heights[right[-1] + 1] > room
    assert len(rest.units) == 60 - len(left) - len(right)
    assert rest.units[0][0] is units[right[-1] + 1][0]


def test_never_a_unit_or_two_alone_on_the_next_sheet():
    units = [[Paragraph("item word word", STYLE)] for _ in range(11)]  # units of one line each
    hu = _unit_height(units[0], 200.0)
    room = 5.5 * hu  # five units a column: one of eleven would be left for the next sheet
    parts = Columns(units, gap=10).split(410, room)
    assert len(parts) == 2
    assert len(parts[1].units) == MIN_UNITS
    left, right = parts[0]._cols
    assert left + right == list(range(11 - MIN_UNITS))


def test_a_document_of_columns_prints_every_item_once_in_order():
    units = _units(150)
    buf = io.BytesIO()
    SimpleDocTemplate(buf, pagesize=(460, 500)).build([Columns(units, gap=10)])
    reader = pypdf.PdfReader(buf)
    assert len(reader.pages) >= 3
    seen = []
    for page in reader.pages:
        seen += [t for t in page.extract_text().split() if t.startswith("item")]
    assert seen == [f"item{k:03d}" for k in range(150)]


def _doc_pages(flowables, size=(460, 500)) -> list[str]:
    buf = io.BytesIO()
    doc = SimpleDocTemplate(buf, pagesize=size)
    for f in flowables:
        if isinstance(f, Columns):
            f.frame_height = doc.height
    doc.build(flowables)
    return [p.extract_text() for p in pypdf.PdfReader(buf).pages]


def test_units_taller_than_a_third_of_a_sheet_still_set_one_by_one():
    """Fewer than MIN_UNITS fit a whole sheet: a fresh sheet takes what fits instead of looping."""
    units = [[Paragraph(f"big{k} " + "word " * 70, STYLE)] for k in range(5)]  # ~40 % of a sheet each
    pages = _doc_pages([Columns(units, gap=10)])
    text = " ".join(pages)
    assert [w for w in text.split() if w.startswith("big")] == [f"big{k}" for k in range(5)]


def test_a_unit_taller_than_a_column_is_set_by_its_flowables():
    unit = [Paragraph(f"part{k} " + "word " * 40, STYLE) for k in range(12)]  # taller than a column
    pages = _doc_pages([Columns([unit], gap=10)])
    assert len(pages) >= 2
    seen = [w for t in pages for w in t.split() if w.startswith("part")]
    assert seen == [f"part{k}" for k in range(12)]


def test_a_head_taller_than_the_room_goes_alone_and_the_list_follows():
    head = Paragraph("HEAD " + "word " * 370, STYLE)  # most of a sheet: no room for three units
    pages = _doc_pages([Columns(_units(6), gap=10, head=head)])
    flat = " ".join(pages)
    assert flat.index("HEAD") < flat.index("item000")


def test_the_part_carried_over_is_titled_continued_and_never_a_sliver():
    units = [[Paragraph(f"line{k:02d} word", STYLE)] for k in range(90)]
    cont = Paragraph("LIST (continued)", STYLE)
    cols = Columns(units, gap=10, head=Paragraph("LIST", STYLE), cont=cont)
    cols.frame_height = 600.0
    hu = _unit_height(units[0], 200.0)
    first, rest = cols.split(410, 44 * hu)  # room for all but a few short lines
    assert rest.head is cont
    cw_heights = [_unit_height(u, 200.0) for u in rest.units]
    assert max(sum(cw_heights[: len(cw_heights) // 2 + 1]), 0) >= MIN_PART * 600.0 - 2 * hu
    assert len(rest.units) >= MIN_UNITS
