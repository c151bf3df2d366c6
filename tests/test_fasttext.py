"""One-line cells written straight as PDF operators and strings encoded once per document
(outputs/report/fasttext.py) against reportlab's own text object and font encoder.

The reference is reportlab (a general-purpose PDF library): its ``PDFTextObject`` (beginText,
setFont, setFillColor, textOut, textLine, drawText inside saveState/restoreState) and its
TrueType font's ``splitString``. The operators we write must be theirs byte for byte, the pieces
of every string the ones reportlab gives, and whole documents identical with and without both.
"""

from __future__ import annotations

import io

import pytest
from reportlab.lib.colors import CMYKColor, Color, HexColor
from reportlab.lib.enums import TA_CENTER, TA_RIGHT
from reportlab.lib.pagesizes import LETTER
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase import pdfmetrics
from reportlab.pdfgen.canvas import Canvas
from reportlab.platypus import SimpleDocTemplate, Table

from calcreport.outputs.report import fastcell, fasttext
from calcreport.outputs.report.fastcell import LineCell, cell
from calcreport.outputs.report.styles import esc, make_styles, register_fonts

FONTS = register_fonts()
ST = make_styles(FONTS, HexColor("#1f3a93"))

SAMPLES = [
    f'<b>{esc("Shear flow at the interface")}</b>  <font color="#7a5a00"><b>[governs]</b></font>',
    f"= {esc('1,500 lbf × 22.10 in³ / 410.0 in⁴')}   = <b>{esc('80.85 lbf/in')}</b>",
    esc("q = V·Q / I  (A < B & C > D) \\ (escaped)"),
    esc("Träger 梁 über Stütze"),
    '<font color="#1d6b35"><b>OK</b></font>',
    f"<b>{esc('Shear flow')}</b>&nbsp;&nbsp; {esc('q = V·Q / I')}&nbsp;&nbsp; = <b>{esc('80.85 lbf/in')}</b>",
    f'{esc("plain")} <font color="#b3261e">{esc("red")}</font> {esc("plain again")}',
]


def _draw(cells: list[LineCell], fast: bool, monkeypatch) -> list[str]:
    """The operators drawing ``cells`` one under the other, with or without the direct path."""
    with monkeypatch.context() as m:
        if not fast:
            m.setattr(fastcell, "draw_line", lambda *a, **k: False)
        c = Canvas(io.BytesIO(), invariant=1)
        for k, f in enumerate(cells):
            f.wrap(400, 100)
            f.drawOn(c, 36, 700 - 14 * k)
        return list(c._code)


@pytest.mark.parametrize("align", [None, TA_CENTER, TA_RIGHT])
@pytest.mark.parametrize("style_name", ["cell", "cell_bold", "caption", "formula"])
def test_one_line_cells_write_the_text_objects_operators(style_name, align, monkeypatch):
    style = getattr(ST, style_name)
    if align is not None:
        style = ParagraphStyle("aligned", parent=style, alignment=align)
    cells = [cell(m, style) for m in SAMPLES]
    assert all(isinstance(f, LineCell) for f in cells)
    fast = _draw(cells, True, monkeypatch)
    assert fast == _draw([cell(m, style) for m in SAMPLES], False, monkeypatch)
    assert fast.count("q") == len(SAMPLES)  # one saved state per line, as the text object has


@pytest.mark.parametrize(
    "colour",
    [CMYKColor(0, 0.5, 1, 0.2), Color(0.2, 0.3, 0.4, alpha=0.5)],
    ids=["cmyk", "translucent"],
)
def test_other_colours_are_left_to_the_text_object(colour):
    c = Canvas(io.BytesIO(), invariant=1)
    before = list(c._code)
    runs = (("x", FONTS.regular, colour),)
    assert not fasttext.draw_line(c, 0, 0, 0, runs, 8, 10)
    assert c._code == before  # nothing written


def test_fonts_other_than_embedded_truetype_are_left_to_the_text_object():
    c = Canvas(io.BytesIO(), invariant=1)
    assert not fasttext.draw_line(c, 0, 0, 0, (("x", "Helvetica", Color(0, 0, 0)),), 8, 10)
    assert c._code == []


def _document(texts: list[str]) -> bytes:
    buf = io.BytesIO()
    doc = SimpleDocTemplate(buf, pagesize=LETTER, invariant=1)
    rows = [[cell(t, ST.cell), cell(t, ST.cell_bold)] for t in texts]
    doc.build([Table(rows * 3, colWidths=[250, 250])])  # every string drawn more than once
    return buf.getvalue()


def test_documents_are_byte_identical_without_the_memo_and_the_direct_path(monkeypatch):
    texts = SAMPLES + [esc(f"row {i}: {'αβγδ'[i % 4]}·{i * 1.5:.2f} in") for i in range(60)]
    ours = _document(texts)
    with monkeypatch.context() as m:
        m.setattr(fastcell, "draw_line", lambda *a, **k: False)
        for name in (FONTS.regular, FONTS.bold):
            m.delattr(pdfmetrics.getFont(name), "splitString")  # reportlab's own method again
        theirs = _document(texts)
    assert ours == theirs


def test_split_strings_are_reportlabs_pieces():
    font = pdfmetrics.getFont(FONTS.regular)
    fasttext.memoise_fonts(FONTS.regular)
    assert "splitString" in vars(font)
    canvas = Canvas(io.BytesIO())
    doc = canvas._doc
    texts = ["abc", "Träger 梁", "abc", "x\u00a0y", "abc def 12.5 in²"] * 2
    got = [font.splitString(t, doc) for t in texts]
    # reportlab's own method on the same document state (codes already given stay given)
    real = type(font).splitString
    assert got == [real(font, t, doc) for t in texts]
    got[0].append((9, b"changed"))  # a caller's list is its own
    assert font.splitString("abc", doc) == real(font, "abc", doc)
