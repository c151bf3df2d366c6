"""The one-line cell fast path (outputs/report/fastcell.py) against reportlab's own Paragraph.

The reference is reportlab's ``Paragraph`` (an independent, general-purpose layout engine): the same
markup in the same style, in the same table, must give the same text read back by pypdf (a PDF
reader outside the project), in the same order and at the same baseline positions; markup or
styles the fast path does not handle, and text that does not fit its column, must come out as a
paragraph. Builds are byte-identical.
"""

from __future__ import annotations

import io

import pytest

pypdf = pytest.importorskip("pypdf")

from reportlab.lib.colors import HexColor  # noqa: E402
from reportlab.lib.enums import TA_CENTER, TA_RIGHT  # noqa: E402
from reportlab.lib.pagesizes import LETTER  # noqa: E402
from reportlab.lib.styles import ParagraphStyle  # noqa: E402
from reportlab.platypus import Paragraph, SimpleDocTemplate, Table, TableStyle  # noqa: E402

from calcreport.outputs.report.fastcell import LineCell, OnceParagraph, cell, runs_of  # noqa: E402
from calcreport.outputs.report.styles import esc, make_styles, register_fonts  # noqa: E402

FONTS = register_fonts()
ST = make_styles(FONTS, HexColor("#1f3a93"))

# markup as the report writes it: labels with a governs tag, substituted formulas with a bold
# result, escaped characters, text needing the CJK fallback font, status cells
SAMPLES = [
    f'<b>{esc("Shear flow at the interface")}</b>  <font color="#7a5a00"><b>[governs]</b></font>',
    f"= {esc('1,500 lbf × 22.10 in³ / 410.0 in⁴')}   = <b>{esc('80.85 lbf/in')}</b>",
    esc("q = V·Q / I  (A < B & C > D)"),
    esc("  leading and   inner   spaces  "),
    esc("Träger 梁 über Stütze"),
    '<font color="#1d6b35"><b>OK</b></font>',
    esc("12'-0\" — n·(I₀ + A·d²)"),
    # a derivation row: label, symbol and numbers held apart by no-break spaces
    f"<b>{esc('Shear flow')}</b>&nbsp;&nbsp; {esc('q = V·Q / I')}&nbsp;&nbsp; = <b>{esc('80.85 lbf/in')}</b>",
    esc("x\u00a0\u00a0 y"),  # no-break spaces are not collapsed
]


def _doc(cells_by_row: list[list], widths: list[float]) -> bytes:
    buf = io.BytesIO()
    doc = SimpleDocTemplate(buf, pagesize=LETTER, invariant=1)
    t = Table(cells_by_row, colWidths=widths)
    t.setStyle(
        TableStyle(
            [("VALIGN", (0, 0), (-1, -1), "TOP"), ("GRID", (0, 0), (-1, -1), 0.3, HexColor("#999999"))]
        )
    )
    doc.build([t])
    return buf.getvalue()


def _glyphs(pdf: bytes) -> list[tuple[str, float, float]]:
    """Every text run pypdf reads, with the baseline position it is drawn at."""
    out: list[tuple[str, float, float]] = []

    def visit(text, cm, tm, font, size):
        if text.strip():
            x = tm[4] * cm[0] + tm[5] * cm[2] + cm[4]
            y = tm[4] * cm[1] + tm[5] * cm[3] + cm[5]
            out.append((text, round(x, 2), round(y, 2)))

    for page in pypdf.PdfReader(io.BytesIO(pdf)).pages:
        page.extract_text(visitor_text=visit)
    return out


def _text(pdf: bytes) -> str:
    return "\n".join(p.extract_text() for p in pypdf.PdfReader(io.BytesIO(pdf)).pages)


@pytest.mark.parametrize("style_name", ["cell", "cell_bold", "formula", "caption", "cell_right"])
def test_fast_cells_read_back_as_the_paragraphs_do(style_name):
    style = getattr(ST, style_name)
    fast = [[cell(m, style)] for m in SAMPLES]
    assert all(isinstance(c[0], LineCell) for c in fast)  # every sample takes the fast path
    slow = [[Paragraph(m, style)] for m in SAMPLES]
    a, b = _doc(fast, [400]), _doc(slow, [400])
    assert _text(a) == _text(b)
    ga, gb = _glyphs(a), _glyphs(b)
    assert [t for t, _, _ in ga] == [t for t, _, _ in gb] or "".join(t for t, _, _ in ga) == "".join(
        t for t, _, _ in gb
    )
    # every line starts where the paragraph starts it (x to 0.05 pt, same baseline)
    first = lambda g: {y: x for _, x, y in reversed(g)}  # noqa: E731 - leftmost run per baseline
    fa, fb = first(ga), first(gb)
    assert sorted(fa) == sorted(fb)
    for y in fa:
        assert fa[y] == pytest.approx(fb[y], abs=0.05)


@pytest.mark.parametrize("align", [TA_CENTER, TA_RIGHT])
def test_centred_and_right_aligned_cells_sit_where_paragraphs_do(align):
    style = ParagraphStyle("x", parent=ST.cell, alignment=align)
    a = _glyphs(_doc([[cell(SAMPLES[1], style)]], [300]))
    b = _glyphs(_doc([[Paragraph(SAMPLES[1], style)]], [300]))
    assert a[0][1:] == pytest.approx(b[0][1:], abs=0.05)


def test_whitespace_collapses_as_in_a_paragraph():
    runs = runs_of(esc("  a   b  "), ST.cell)
    assert runs is not None and "".join(t for t, _, _ in runs) == "a b"
    assert runs_of("<b>x</b>  <b> y</b>", ST.cell) is not None
    assert "".join(t for t, _, _ in runs_of("<b>x</b>  <b> y</b>", ST.cell)) == "x y"
    # reportlab splits words on its own list of spaces, which leaves out the no-break space
    nb = runs_of("a&nbsp;&nbsp;  b\u2009\u2009c", ST.cell)
    assert nb is not None and "".join(t for t, _, _ in nb) == "a\u00a0\u00a0 b c"


@pytest.mark.parametrize(
    "markup",
    [
        "x<super>2</super>",  # tags the fast path does not draw
        "<i>italic</i>",
        "a<br/>b",
        "a &copy; b",  # an entity that is not one of esc()'s escapes (nor &nbsp;)
        '<font size="12">big</font>',
        "",
    ],
)
def test_other_markup_falls_back_to_a_paragraph(markup):
    out = cell(markup, ST.cell)
    assert isinstance(out, Paragraph) and not isinstance(out, LineCell)


@pytest.mark.parametrize("markup", ["<b>unclosed", "stray </b> close"])
def test_malformed_markup_is_refused_as_a_paragraph_refuses_it(markup):
    with pytest.raises(ValueError):
        Paragraph(markup, ST.cell)
    with pytest.raises(ValueError):
        cell(markup, ST.cell)


def test_styles_with_indents_or_background_fall_back():
    for kw in ({"leftIndent": 4}, {"firstLineIndent": 6}, {"backColor": HexColor("#eeeeee")}):
        assert isinstance(cell("plain", ParagraphStyle("s", parent=ST.cell, **kw)), OnceParagraph)


def test_text_wider_than_its_column_wraps_as_a_paragraph():
    long = esc("design shear from the envelope of every combination with variable loads placed " * 3)
    c = cell(long, ST.cell)
    assert isinstance(c, LineCell)
    w, h = c.wrap(120, 1000)
    ref = Paragraph(long, ST.cell)
    assert (w, h) == ref.wrap(120, 1000)
    assert h > 3 * ST.cell.leading
    assert _text(_doc([[cell(long, ST.cell)]], [126])) == _text(_doc([[Paragraph(long, ST.cell)]], [126]))
    # and a narrow column the one-line sample does not fit either
    assert c.wrap(2000, 1000) == (2000, ST.cell.leading)


def test_a_paragraph_breaks_its_lines_once_per_width(monkeypatch):
    p = OnceParagraph(esc("a fairly long line of words to be broken " * 4), ST.cell)
    calls = []
    real = Paragraph.breakLines
    monkeypatch.setattr(Paragraph, "breakLines", lambda self, w: calls.append(w) or real(self, w))
    first = p.wrap(150, 500)
    assert p.wrap(150, 900) == first and len(calls) == 1
    p.wrap(200, 500)
    assert len(calls) == 2


def test_fast_cells_build_byte_identical_documents():
    rows = [[cell(m, ST.cell), cell(m, ST.formula)] for m in SAMPLES]
    again = [[cell(m, ST.cell), cell(m, ST.formula)] for m in SAMPLES]
    assert _doc(rows, [250, 250]) == _doc(again, [250, 250])


def test_table_rows_split_across_pages_keep_every_cell():
    rows = [[cell(esc(f"row {i}"), ST.cell), cell(SAMPLES[1], ST.formula)] for i in range(150)]
    text = _text(_doc(rows, [80, 400]))
    for i in range(150):
        assert f"row {i}\n" in text + "\n"


def test_repeated_markup_is_parsed_once_and_lays_out_as_a_fresh_paragraph(monkeypatch):
    from reportlab.platypus import paraparser

    text = esc("mechanics of materials (q = V·Q/I; spacing s = n·F/q), repeated for every step " * 2)
    style = ParagraphStyle("repeat", parent=ST.caption)
    parses = []
    real = paraparser.ParaParser.parse
    monkeypatch.setattr(paraparser.ParaParser, "parse", lambda self, *a: parses.append(1) or real(self, *a))
    cells = [[OnceParagraph(text, style)] for _ in range(6)]
    assert len(parses) == 1
    fresh = [[Paragraph(text, style)] for _ in range(6)]
    assert _doc(cells, [140]) == _doc(fresh, [140])  # the same bytes as paragraphs parsed one by one


LONG = [
    esc("mechanics of materials (q = V·Q/I; spacing s = n·F/q) for the joint of the top flange"),
    esc("ASCE 7-22 §2.4.1 (basic combinations, allowable stress design), with variable loads placed"),
    esc("common practice, no source (spacing rounded down to the increment)"),
    esc("Träger 梁 über Stütze, a line long enough to wrap in every column it is given here"),
]


@pytest.mark.parametrize("width", [70, 110, 160])
@pytest.mark.parametrize("align", [None, TA_CENTER, TA_RIGHT])
def test_text_of_one_run_wraps_on_the_lines_a_paragraph_breaks(width, align):
    style = ST.caption if align is None else ParagraphStyle("a", parent=ST.caption, alignment=align)
    fast = [[cell(m, style)] for m in LONG]
    for c in fast:
        c[0].wrap(width - 12, 1000)  # the table's padding: 6 each side
    assert any(isinstance(c[0], LineCell) and c[0]._lines for c in fast)  # drawn as lines of our own
    slow = [[Paragraph(m, style)] for m in LONG]
    a, b = _doc(fast, [width]), _doc(slow, [width])
    assert _text(a) == _text(b)
    ga, gb = _glyphs(a), _glyphs(b)
    first = lambda g: sorted({y: x for _, x, y in reversed(g)}.items())  # noqa: E731
    fa, fb = first(ga), first(gb)
    assert len(fa) == len(fb)
    for (ya, xa), (yb, xb) in zip(fa, fb):
        assert ya == pytest.approx(yb, abs=0.02) and xa == pytest.approx(xb, abs=0.05)
    for m in LONG:  # the same height in the table as the paragraph
        assert cell(m, style).wrap(width - 12, 1000) == Paragraph(m, style).wrap(width - 12, 1000)


def test_a_word_wider_than_its_line_is_split_by_the_paragraph():
    word = esc("x" * 80)
    c = cell(word, ST.caption)
    assert c.wrap(60, 1000) == Paragraph(word, ST.caption).wrap(60, 1000)
    assert c._lines is None and not c._fits  # the paragraph splits the long word
