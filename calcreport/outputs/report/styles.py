"""Fonts, paragraph styles and safe text for the PDF report.

Every piece of text from a job file goes through :func:`esc` before it becomes Paragraph markup:
it is XML-escaped (so ``<b>`` or ``&`` print literally), characters the embedded DejaVu fonts lack
(CJK) are set in the embedded Droid Sans Fallback, and control characters are dropped.
Words too long for a line are broken by the Paragraph itself (``splitLongWords``).
"""

from __future__ import annotations

import unicodedata
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path

from reportlab.lib import colors
from reportlab.lib.enums import TA_LEFT
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase import pdfmetrics
from reportlab.pdfbase.ttfonts import TTFont

__all__ = [
    "FONT_DIR",
    "Fonts",
    "register_fonts",
    "Styles",
    "make_styles",
    "esc",
    "plain",
    "fit_text",
    "font_runs",
    "text_width",
    "draw_text",
    "FALLBACK_FONT",
]


def escape(text: str) -> str:
    """``&``, ``<`` and ``>`` as entities (what ``xml.sax.saxutils.escape`` does; that module
    imports ``urllib.request``, ``http.client`` and ``ssl`` with it: 20-40 ms of every build)."""
    return text.replace("&", "&amp;").replace(">", "&gt;").replace("<", "&lt;")


FONT_DIR = Path(__file__).resolve().parents[2] / "data" / "fonts"
#: Embedded fallback for scripts DejaVu does not cover (CJK): Droid Sans Fallback (Apache 2.0),
#: registered only when a text needs it and subset into the PDF like the other fonts.
FALLBACK_FONT = "CR-DroidSansFallbackFull"
FALLBACK_FILE = "DroidSansFallbackFull.ttf"


@dataclass(frozen=True)
class Fonts:
    """Registered font names used by every style."""

    regular: str
    bold: str
    mono: str


def register_fonts(regular: Path | None = None, bold: Path | None = None, mono: Path | None = None) -> Fonts:
    """Register the TrueType fonts (bundled DejaVu unless a template gives others); idempotent."""
    files = {
        "regular": regular or FONT_DIR / "DejaVuSansCondensed.ttf",
        "bold": bold or FONT_DIR / "DejaVuSansCondensed-Bold.ttf",
        "mono": mono or FONT_DIR / "DejaVuSansMono.ttf",
    }
    names = {}
    for role, path in files.items():
        name = _font_name(Path(path), role)
        if name not in pdfmetrics.getRegisteredFontNames():
            pdfmetrics.registerFont(TTFont(name, str(path)))
        names[role] = name
    pdfmetrics.registerFontFamily(
        names["regular"],
        normal=names["regular"],
        bold=names["bold"],
        italic=names["regular"],
        boldItalic=names["bold"],
    )
    _BODY[0] = names["regular"]
    return Fonts(names["regular"], names["bold"], names["mono"])


def _font_name(path: Path, role: str) -> str:
    stem = "".join(c for c in path.stem if c.isalnum() or c == "-")
    return f"CR-{stem}" if path.parent == FONT_DIR else f"CR-{role}-{stem}"


@lru_cache(maxsize=1)
def _register_fallback() -> bool:
    try:
        pdfmetrics.registerFont(TTFont(FALLBACK_FONT, str(FONT_DIR / FALLBACK_FILE)))
        return True
    except Exception:  # pragma: no cover - a damaged or missing font file: characters stay as boxes
        return False


@lru_cache(maxsize=8)
def _covered(font_name: str) -> frozenset[int]:
    font = pdfmetrics.getFont(font_name)
    return frozenset(getattr(font.face, "charToGlyph", {}).keys())


def _clean(text: object) -> str:
    """Drop control characters (keep tabs as spaces); NFC-normalise."""
    text = unicodedata.normalize("NFC", str(text))
    if text.isprintable():  # no control character, no tab or line break (nearly every text)
        return text
    return "".join(
        " " if c in "\t\r\n" else c for c in text if c in "\t\r\n" or unicodedata.category(c)[0] != "C"
    )


_BODY = ["CR-DejaVuSansCondensed"]


def esc(text: object) -> str:
    """Paragraph-markup-safe text: escaped, with uncovered characters in the fallback font."""
    return _esc(str(text), _BODY[0])


@lru_cache(maxsize=16384)
def _esc(text: str, body_font: str) -> str:  # report text repeats a lot (labels, units, sources)
    text = _clean(text)
    try:
        covered = _covered(body_font)
    except KeyError:
        return escape(text)
    if covered.issuperset(map(ord, text.replace(" ", ""))):  # every character in the body font
        return escape(text)
    out: list[str] = []
    run: list[str] = []
    fallback = None
    for c in text:
        if not (ord(c) in covered or c == " ") and fallback is None:
            fallback = _register_fallback()  # only jobs with such text pay for loading it
        if ord(c) in covered or c == " " or not fallback:
            if run:
                out.append(f'<font name="{FALLBACK_FONT}">{escape("".join(run))}</font>')
                run = []
            out.append(escape(c))
        else:
            run.append(c)
    if run:
        out.append(f'<font name="{FALLBACK_FONT}">{escape("".join(run))}</font>')
    return "".join(out)


def plain(text: object) -> str:
    """Text for direct canvas drawing (no markup): control characters dropped."""
    return _clean(text)


def font_runs(text: str, font: str) -> list[tuple[str, str]]:
    """``text`` cut into runs of ``(characters, font)``: the font where it has the glyphs, the
    embedded fallback (CJK) elsewhere — for text drawn straight on the canvas."""
    try:
        covered = _covered(font)
    except KeyError:
        return [(text, font)]
    if covered.issuperset(map(ord, text.replace(" ", ""))):
        return [(text, font)]
    runs: list[tuple[str, str]] = []
    for c in text:
        f = font if (ord(c) in covered or c == " ") else (FALLBACK_FONT if _register_fallback() else font)
        if runs and runs[-1][1] == f:
            runs[-1] = (runs[-1][0] + c, f)
        else:
            runs.append((c, f))
    return runs


def text_width(text: str, font: str, size: float) -> float:
    """Width of ``text`` drawn with :func:`draw_text`."""
    return sum(pdfmetrics.stringWidth(t, f, size) for t, f in font_runs(text, font))


def draw_text(c, x: float, y: float, text: str, font: str, size: float) -> None:
    """Draw ``text`` at (x, y), switching to the fallback font for glyphs ``font`` lacks."""
    for t, f in font_runs(text, font):
        c.setFont(f, size)
        c.drawString(x, y, t)
        x += pdfmetrics.stringWidth(t, f, size)
    c.setFont(font, size)


@lru_cache(maxsize=4096)  # title-block fields repeat on every sheet
def fit_text(text: str, font: str, size: float, width: float, min_size: float = 5.5) -> tuple[str, float]:
    """Shrink ``text`` down to ``min_size`` to fit ``width``; then cut it with an ellipsis."""
    text = plain(text)
    s = size
    while s > min_size and text_width(text, font, s) > width:
        s -= 0.25
    if text_width(text, font, s) <= width:
        return text, s
    lo, hi = 0, len(text)
    while lo < hi:
        mid = (lo + hi + 1) // 2
        if text_width(text[:mid] + "…", font, s) <= width:
            lo = mid
        else:
            hi = mid - 1
    return text[:lo] + "…", s


@dataclass(frozen=True)
class Styles:
    """Paragraph styles and colours of one report."""

    fonts: Fonts
    accent: colors.Color
    tint: colors.Color
    body: ParagraphStyle
    small: ParagraphStyle
    cell: ParagraphStyle
    cell_bold: ParagraphStyle
    cell_right: ParagraphStyle
    formula: ParagraphStyle
    h1: ParagraphStyle
    h2: ParagraphStyle
    h3: ParagraphStyle
    caption: ParagraphStyle


def make_styles(fonts: Fonts, accent: colors.Color, size: float = 9.0) -> Styles:
    """The report's styles: one sans family, modest sizes, accent colour for headings only."""
    tint = colors.Color(
        accent.red + (1 - accent.red) * 0.88,
        accent.green + (1 - accent.green) * 0.88,
        accent.blue + (1 - accent.blue) * 0.88,
    )
    base = ParagraphStyle(
        "body",
        fontName=fonts.regular,
        fontSize=size,
        leading=size * 1.3,
        alignment=TA_LEFT,
        splitLongWords=1,
        spaceAfter=size * 0.45,
    )

    def derive(name: str, **kw) -> ParagraphStyle:
        return ParagraphStyle(name, parent=base, **kw)

    return Styles(
        fonts=fonts,
        accent=accent,
        tint=tint,
        body=base,
        small=derive("small", fontSize=size - 1.5, leading=(size - 1.5) * 1.3),
        cell=derive("cell", fontSize=size - 1, leading=(size - 1) * 1.25, spaceAfter=0),
        cell_bold=derive(
            "cell_bold", fontName=fonts.bold, fontSize=size - 1, leading=(size - 1) * 1.25, spaceAfter=0
        ),
        cell_right=derive(
            "cell_right", fontSize=size - 1, leading=(size - 1) * 1.25, spaceAfter=0, alignment=2
        ),
        formula=derive("formula", fontName=fonts.regular, fontSize=size, leading=size * 1.35, spaceAfter=0),
        h1=derive(
            "h1",
            fontName=fonts.bold,
            fontSize=size + 6,
            leading=(size + 6) * 1.25,
            textColor=accent,
            spaceBefore=0,
            spaceAfter=size * 0.8,
        ),
        h2=derive(
            "h2",
            fontName=fonts.bold,
            fontSize=size + 2.5,
            leading=(size + 2.5) * 1.3,
            textColor=accent,
            spaceBefore=size * 1.1,
            spaceAfter=size * 0.5,
        ),
        h3=derive(
            "h3",
            fontName=fonts.bold,
            fontSize=size + 0.5,
            leading=(size + 0.5) * 1.3,
            spaceBefore=size * 0.7,
            spaceAfter=size * 0.3,
        ),
        caption=derive(
            "caption", fontSize=size - 1.5, leading=(size - 1.5) * 1.3, textColor=colors.HexColor("#333333")
        ),
    )
