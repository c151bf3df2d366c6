"""One-line table cells without a full paragraph parse (issue 15 item 8).

Most table cells are one short line (a label, a formula, a number with its unit); a reportlab
``Paragraph`` parses its markup with an HTML parser and breaks lines on each of the two or three
``wrap`` calls a table makes of it. :func:`cell` is the one factory the table and
derivation code calls instead of ``Paragraph(markup, style)``: it reads the small markup subset
the report writes itself (``<b>``, ``<font color=…>``, ``<font name=…>``, the escapes of
:func:`..styles.esc`), measures the line once, and returns a :class:`LineCell` that draws the
runs as one line when they fit the width it is given. Anything else — other tags, a style with
indents, borders or a background, text wider than the column — is a ``Paragraph`` as before
(built only when needed), so the fast path never changes what is printed, only how fast.

The line is laid out as the paragraph would: white space collapsed and stripped, one line of
``style.leading``, baseline ``fontSize`` below its top (reportlab's ``paraFontSizeHeightOffset``).
"""

from __future__ import annotations

import re
from functools import lru_cache
from html import unescape

from reportlab import rl_config
from reportlab.lib.colors import Color, toColor
from reportlab.lib.enums import TA_CENTER, TA_JUSTIFY, TA_LEFT, TA_RIGHT
from reportlab.lib.fonts import ps2tt, tt2ps
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase.pdfmetrics import getAscentDescent, stringWidth
from reportlab.platypus import Flowable, Paragraph

from .fasttext import draw_line, memoise_fonts

__all__ = ["cell", "LineCell", "OnceParagraph", "runs_of"]

_TOKEN = re.compile(r"<(/?)([a-z]+)((?:\s+[a-z]+=\"[^\"<>]*\")*)\s*>|([^<]+)")
_ATTR = re.compile(r'([a-z]+)="([^"]*)"')
#: the white space a paragraph splits words on (reportlab's list: every Unicode space but the
#: no-break space U+00A0, which stays inside its word — ``\s`` would collapse it)
_WHITE = (
    "\u0009\u000a\u000b\u000c\u000d\u001c\u001d\u001e\u001f\u0020\u0085\u1680\u2000\u2001\u2002\u2003"
    "\u2004\u2005\u2006\u2007\u2008\u2009\u200a\u200b\u2028\u2029\u202f\u205f\u3000"
)
_SPACE = re.compile(f"[{re.escape(_WHITE)}]+")
#: escapes that ``styles.esc`` writes (html.escape) and the no-break spaces the derivation rows
#: put between label, symbol and numbers; each unescapes exactly
_ENTITY = re.compile(r"&(?:amp|lt|gt|quot|#x27|#39|nbsp);")

Run = tuple[str, str, Color]  # text, font name, colour


def _bold(font: str) -> str | None:
    """The bold face of ``font`` as the paragraph parser finds it (the registered family)."""
    try:
        family, _, italic = ps2tt(font)
        return tt2ps(family, 1, italic)
    except (KeyError, ValueError):
        return None


@lru_cache(maxsize=16384)
def _runs(markup: str, font: str, colour: Color) -> tuple[Run, ...] | None:
    """The runs of one line of markup, white space collapsed as a paragraph collapses it, or
    ``None`` when the markup holds anything but the subset above (or an ``&`` that is not one
    of its escapes)."""
    stack: list[tuple[str, str, Color]] = [("", font, colour)]
    runs: list[Run] = []
    pos = 0
    for m in _TOKEN.finditer(markup):
        if m.start() != pos:
            return None
        pos = m.end()
        closing, tag, attrs, text = m.groups()
        if text is not None:
            if "&" in _ENTITY.sub("", text):
                return None
            _, f, c = stack[-1]
            runs.append((unescape(text), f, c))
            continue
        if closing:
            if attrs or len(stack) == 1 or stack[-1][0] != tag:
                return None
            stack.pop()
            continue
        _, f, c = stack[-1]
        if tag == "b" and not attrs:
            bold = _bold(f)
            if bold is None:
                return None
            stack.append(("b", bold, c))
        elif tag == "font" and attrs:
            for key, value in _ATTR.findall(attrs):
                if key == "color":
                    try:
                        c = toColor(value)
                    except ValueError:
                        return None
                elif key == "name":
                    f = value
                else:
                    return None
            stack.append(("font", f, c))
        else:
            return None
    if pos != len(markup) or len(stack) != 1:
        return None
    out = _collapse(runs)
    memoise_fonts(*{f for _, f, _ in out})  # their strings are then encoded once per document
    return out


def _collapse(runs: list[Run]) -> tuple[Run, ...]:
    """White space as a paragraph lays out one line: runs of it become one space (in the run
    where they begin), none at the ends; empty runs dropped, neighbours of one face merged."""
    out: list[Run] = []
    space = True  # drop white space at the start
    for text, font, colour in runs:
        text = _SPACE.sub(" ", text)
        if space:
            text = text.lstrip(" ")
        if not text:
            continue
        space = text.endswith(" ")
        if out and out[-1][1] == font and out[-1][2] == colour:
            out[-1] = (out[-1][0] + text, font, colour)
        else:
            out.append((text, font, colour))
    while out and out[-1][0].endswith(" "):
        text, font, colour = out[-1]
        text = text.rstrip(" ")
        if text:
            out[-1] = (text, font, colour)
        else:
            out.pop()
    return tuple(out)


def runs_of(markup: str, style: ParagraphStyle) -> tuple[Run, ...] | None:
    """The runs :func:`cell` would draw for ``markup`` in ``style`` (``None``: a paragraph)."""
    return _runs(markup, style.fontName, toColor(style.textColor))


_ALIGN = {TA_LEFT: 0, TA_JUSTIFY: 0, TA_CENTER: 1, TA_RIGHT: 2}


def _plain_style(style: ParagraphStyle) -> bool:
    """A style whose one-line layout is the plain one drawn here: no indents, border,
    background, bullets, CJK/right-to-left wrapping, automatic leading or text transform."""
    g = style.__dict__.get
    return (
        style.alignment in _ALIGN
        and not (style.leftIndent or style.rightIndent or style.firstLineIndent)
        and not style.backColor
        and not (style.borderWidth and style.borderColor)
        and style.wordWrap in (None, "", "LTR")
        and getattr(style, "autoLeading", "") in ("", "off", None)
        and not getattr(style, "textTransform", None)
        and not g("underline")
        and not g("strike")
        and not getattr(style, "bulletText", None)
    )


#: parsed markup by (markup, style): (style, parsed style, text, fragments, bullet text)
_PARSED: dict[tuple[str, int], tuple[ParagraphStyle, ParagraphStyle, str, list, object]] = {}
_PARSED_MAX = 8192


class OnceParagraph(Paragraph):
    """A paragraph that parses its markup once per text and style and breaks its lines once per
    width. A table wraps each cell for its row heights, for a split and to draw it: the same
    width gives the same lines (``availHeight`` plays no part). Repeated texts in the same style
    (sources, captions, column heads) take the first one's parsed fragments (``Paragraph``'s own
    ``frags`` argument; a paragraph never changes the fragments it is given — line breaking and
    splitting work on clones). The cache holds its styles, so a key's style id cannot be reused
    while cached; it is emptied when full."""

    _wrapped: tuple[float, tuple[float, float], object] | None = None

    def __init__(self, text, style=None, bulletText=None, frags=None, **kw):  # noqa: N803
        if frags is not None or bulletText is not None or kw or style is None or not isinstance(text, str):
            super().__init__(text, style, bulletText, frags, **kw)  # split parts, anything unusual
            return
        key = (text, id(style))
        hit = _PARSED.get(key)
        if hit is not None and hit[0] is style:
            self.caseSensitive, self.encoding = 1, "utf8"
            _, parsed, clean, frags, bullet = hit
            self._setup(clean, parsed, bullet, list(frags), None)
            return
        super().__init__(text, style)
        if len(_PARSED) >= _PARSED_MAX:
            _PARSED.clear()
        _PARSED[key] = (style, self.style, self.text, list(self.frags), self.bulletText)

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:  # noqa: N803
        done = self._wrapped
        # the lines must still be the ones broken then (``split`` may drop them)
        if done is not None and done[0] == availWidth and self.__dict__.get("blPara") is done[2]:
            self.width, self.height = done[1]
            return done[1]
        size = super().wrap(availWidth, availHeight)
        self._wrapped = (availWidth, size, self.blPara)
        return size


def _breakable(style: ParagraphStyle) -> bool:
    """A style whose lines break by the plain greedy rule of a paragraph of one fragment: no
    hyphenation of any kind, no shaping, no justified lines."""
    return (
        style.alignment != TA_JUSTIFY
        and not getattr(style, "hyphenationLang", "")
        and not getattr(style, "uriWasteReduce", 0)
        and not getattr(style, "embeddedHyphenation", 0)
        and not getattr(style, "shaping", 0)
    )


def break_lines(text: str, font: str, size: float, width: float, shrink: float, split_long: bool):
    """The lines of one run of text, as reportlab's paragraph breaks a single fragment: words
    added greedily while the line, its spaces allowed to shrink by ``shrink`` × the space width
    each, stays within ``width``; a word alone on its line even when wider. Returns
    [(width − line width, words)], or ``None`` where the paragraph would do something else —
    split a word wider than the line (``splitLongWords``), break at a soft hyphen, or squeeze a
    line's spaces — so that a paragraph takes over."""
    if "\u00ad" in text:
        return None
    space = stringWidth(" ", font, size)
    d_shrink = shrink * space
    lines: list[tuple[float, list[str]]] = []
    line: list[str] = []
    current = -space
    for word in text.split(" "):
        ww = stringWidth(word, font, size)
        new = current + space + ww
        limit = width + d_shrink * len(line)
        if new > limit and split_long and ww > width:
            return None
        if new <= limit or not line:
            line.append(word)
            current = new
        else:
            lines.append((width - current, line))
            line, current = [word], ww
    if line:
        lines.append((width - current, line))
    if any(extra < -1e-8 and len(words) > 1 for extra, words in lines):
        return None
    return lines


class LineCell(Flowable):
    """Runs of text in one size, measured once, drawn straight on the canvas: one line when they
    fit the width offered; several lines when the text is one run (one font, one colour), broken
    as a paragraph breaks it (:func:`break_lines`); a paragraph takes over otherwise."""

    def __init__(self, markup: str, style: ParagraphStyle, runs: tuple[Run, ...]):
        super().__init__()
        self.text = markup  # as a Paragraph's ``text``: the markup it was given
        self.style = style
        self._runs = runs
        self._size = style.fontSize
        self._leading = style.leading
        self._line_width = sum(stringWidth(t, f, self._size) for t, f, _ in runs)
        self._para: OnceParagraph | None = None
        self._fits = True
        self._lines: list[tuple[float, list[str]]] | None = None  # several lines, else None
        self._broken: tuple[float, list | None] | None = None  # (width, lines) last broken
        self._multi = len(runs) == 1 and _breakable(style)

    # -- the paragraph it stands for -------------------------------------------------------
    def _paragraph(self) -> OnceParagraph:
        if self._para is None:
            self._para = OnceParagraph(self.text, self.style)
        return self._para

    def getPlainText(self, identify=None) -> str:  # noqa: N802 - reportlab's name
        return "".join(t for t, _, _ in self._runs)

    def getSpaceBefore(self) -> float:  # noqa: N802
        return self.style.spaceBefore

    def getSpaceAfter(self) -> float:  # noqa: N802
        return self.style.spaceAfter

    def minWidth(self) -> float:  # noqa: N802
        return self._paragraph().minWidth()

    # -- layout ----------------------------------------------------------------------------
    def _broken_at(self, width: float) -> list | None:
        if self._broken is None or self._broken[0] != width:
            text, font, _ = self._runs[0]
            shrink = getattr(self.style, "spaceShrinkage", 0) or 0
            lines = break_lines(text, font, self._size, width, shrink, bool(self.style.splitLongWords))
            self._broken = (width, lines)
        return self._broken[1]

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:  # noqa: N803
        self._lines = None
        self._fits = self._line_width <= availWidth
        if not self._fits and self._multi and availWidth >= 1e-6:
            self._lines = self._broken_at(availWidth)
            self._fits = self._lines is not None
        if not self._fits:
            return self._paragraph().wrap(availWidth, availHeight)
        self.width = availWidth
        self.height = self._leading * (len(self._lines) if self._lines is not None else 1)
        return self.width, self.height

    def split(self, availWidth: float, availHeight: float) -> list:  # noqa: N803
        if self._line_width <= availWidth:
            return [] if availHeight < self._leading else [self]
        lines = self._broken_at(availWidth) if self._multi else None
        if lines is not None and len(lines) * self._leading <= availHeight:
            return [self]
        return self._paragraph().split(availWidth, availHeight)

    def drawOn(self, canvas, x: float, y: float, _sW: float = 0) -> None:  # noqa: N802, N803
        """Draw at (x, y): the paragraph when the text did not fit, else the runs straight on the
        canvas at their absolute position (one saved graphics state, no translation)."""
        if not self._fits:
            self._paragraph().drawOn(canvas, x, y, _sW)
            return
        x = self._hAlignAdjust(x, _sW)
        self.canv = canvas
        try:
            if self._lines is not None:
                self._draw_lines(x, y)
            else:
                self._draw_at(x, y)
        finally:
            del self.canv

    def draw(self) -> None:
        if self._lines is not None:
            self._draw_lines(0.0, 0.0)
        else:
            self._draw_at(0.0, 0.0)

    def _ascent(self) -> float:
        return getAscentDescent(self._runs[0][1], self._size)[0]

    def _draw_lines(self, x0: float, y0: float) -> None:
        """The lines of one run as a paragraph sets them: one text object, the first baseline
        ``fontSize`` below the top, each line started by its alignment and ended by T*."""
        assert self._lines is not None
        c = self.canv
        align = _ALIGN[self.style.alignment]
        text, font, colour = self._runs[0]
        offset = self._size if rl_config.paraFontSizeHeightOffset else self._ascent()
        c.saveState()
        t = c.beginText(x0, y0 + self.height - offset)
        t.setFont(font, self._size, self._leading)
        t.setFillColor(colour)
        for extra, words in self._lines:
            dx = 0.0 if align == 0 else extra * (0.5 if align == 1 else 1.0)
            if dx:
                t.setXPos(dx)
            t.textLine(" ".join(words))
            if dx:
                t.setXPos(-dx)
        c.drawText(t)
        c.restoreState()

    def _draw_at(self, x0: float, y0: float) -> None:
        c = self.canv
        align = _ALIGN[self.style.alignment]
        x = 0.0 if align == 0 else (self.width - self._line_width) * (0.5 if align == 1 else 1.0)
        offset = self._size if rl_config.paraFontSizeHeightOffset else self._ascent()
        if draw_line(c, x0, y0 + self.height - offset, x, self._runs, self._size, self._leading):
            return  # the operators below, written directly (fasttext.draw_line)
        c.saveState()
        t = c.beginText(x0, y0 + self.height - offset)
        if x:  # moved to the line's start as a paragraph moves there (readers see the same)
            t.setXPos(x)
        font = colour = None
        last = len(self._runs) - 1
        for k, (text, run_font, run_colour) in enumerate(self._runs):
            if run_font != font:
                t.setFont(run_font, self._size, self._leading)
                font = run_font
            if run_colour != colour:
                t.setFillColor(run_colour)
                colour = run_colour
            # the last run ends the line as a paragraph ends it (T*): readers see the same breaks
            (t.textLine if k == last else t.textOut)(text)
        if x:
            t.setXPos(-x)
        c.drawText(t)
        c.restoreState()


def cell(markup: str, style: ParagraphStyle) -> Flowable:
    """A table cell of ``markup`` (the report's paragraph markup) in ``style``: a
    :class:`LineCell` when the markup is the plain subset and the style a plain one, else a
    ``Paragraph``. A ``LineCell`` still becomes a paragraph where its line does not fit."""
    runs = runs_of(markup, style) if _plain_style(style) else None
    if not runs:
        return OnceParagraph(markup, style)
    return LineCell(markup, style, runs)
